import { Router } from 'express';
import rateLimit from 'express-rate-limit';
import { linkTokenBodySchema, passwordResetAnswer, passwordResetRequestSchema, setPasswordSchema } from '../../shared/mail/account-schemas';
import type { Config } from '../config';
import { parseInput } from '../middleware/validate';
import { runInBackground } from '../services/mail-outbox-service';
import { describeLinkToken, requestPasswordReset, setPasswordWithToken } from '../services/password-reset-service';

/** Mounted under /api/auth, before sign-in is required: the reset request and the set-password link. */
export function passwordRoutes(config: Config): Router {
  const router = Router();

  const limiter = (limit: number) =>
    rateLimit({
      windowMs: config.passwordResetRateWindowMinutes * 60_000,
      limit,
      standardHeaders: 'draft-8',
      legacyHeaders: false,
      handler: (_req, res) => {
        res.status(429).json({ error: { code: 'rate_limited', message: 'Too many requests from this address. Wait a few minutes and try again.' } });
      },
    });

  router.post('/password-reset', limiter(config.passwordResetRateLimit), (req, res) => {
    const { email } = parseInput(passwordResetRequestSchema, req.body);
    // Answered before the lookup, so neither the words nor the timing tell whether the address has an account.
    runInBackground('password reset request', () => requestPasswordReset(email));
    res.status(202).json({ message: passwordResetAnswer });
  });

  // Guessing a 256-bit token is hopeless, but the check is cheap to cap all the same.
  const linkLimiter = limiter(config.passwordResetRateLimit * 10);

  router.post('/password-token', linkLimiter, async (req, res) => {
    const { token } = parseInput(linkTokenBodySchema, req.body);
    res.json({ link: await describeLinkToken(token) });
  });

  router.post('/password', linkLimiter, async (req, res) => {
    const input = parseInput(setPasswordSchema, req.body);
    const result = await setPasswordWithToken(input, req.sessionID ?? null);
    res.json({ ok: true, purpose: result.purpose, email: result.email });
  });

  return router;
}
