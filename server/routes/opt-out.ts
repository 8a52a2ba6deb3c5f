import { Router } from 'express';
import rateLimit from 'express-rate-limit';
import { optOutBodySchema } from '../../shared/data-rights/opt-out';
import type { Config } from '../config';
import { parseInput } from '../middleware/validate';
import { describeOptOutLink, optOutWithToken } from '../services/opt-out-service';

/** Mounted under /api/opt-out before sign-in is required: the athlete's link from an e-mail. */
export function optOutRoutes(config: Config): Router {
  const router = Router();
  // Guessing a 256-bit token is hopeless, but the check is cheap to cap all the same (as for staff links).
  router.use(
    rateLimit({
      windowMs: config.passwordResetRateWindowMinutes * 60_000,
      limit: config.passwordResetRateLimit * 10,
      standardHeaders: 'draft-8',
      legacyHeaders: false,
      handler: (_req, res) => {
        res.status(429).json({ error: { code: 'rate_limited', message: 'Too many requests from this address. Wait a few minutes and try again.' } });
      },
    }),
  );

  // A POST, like the staff links: the token stays out of URLs the server logs, and nothing changes until confirmed.
  router.post('/check', async (req, res) => {
    const { token } = parseInput(optOutBodySchema, req.body);
    res.json({ link: await describeOptOutLink(token) });
  });

  router.post('/', async (req, res) => {
    const { token } = parseInput(optOutBodySchema, req.body);
    res.json(await optOutWithToken(token));
  });

  return router;
}
