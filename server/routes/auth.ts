import { Router, type RequestHandler } from 'express';
import passport from 'passport';
import rateLimit from 'express-rate-limit';
import { signInSchema, type SessionUser } from '../../shared/auth/schemas';
import { AppError } from '../errors';
import { parseInput } from '../middleware/validate';
import type { Config } from '../config';

const GENERIC_SIGN_IN_ERROR = 'That e-mail and password do not match an active account.';

export function authRoutes(config: Config, generateCsrfToken: (req: any, res: any) => string): Router {
  const router = Router();

  // Counts failed attempts only, per address; the answer never says whether the account exists.
  const signInLimiter = rateLimit({
    windowMs: config.loginRateWindowMinutes * 60_000,
    limit: config.loginRateLimit,
    skipSuccessfulRequests: true,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: (_req, res) => {
      res.status(429).json({ error: { code: 'rate_limited', message: 'Too many sign-in attempts. Wait a few minutes and try again.' } });
    },
  });

  router.get('/csrf', (req, res) => {
    // The token is bound to the session id, so the session must be kept from here on.
    req.session.csrfIssued = true;
    res.json({ token: generateCsrfToken(req, res) });
  });

  const signIn: RequestHandler = (req, res, next) => {
    const credentials = parseInput(signInSchema, req.body);
    req.body = credentials;
    passport.authenticate('local', (err: unknown, user: SessionUser | false) => {
      if (err) return next(err);
      if (!user) return next(AppError.unauthorized(GENERIC_SIGN_IN_ERROR));
      // passport ≥ 0.6 regenerates the session id here, against session fixation.
      req.logIn(user, (loginErr) => {
        if (loginErr) return next(loginErr);
        res.json({ user });
      });
    })(req, res, next);
  };
  router.post('/login', signInLimiter, signIn);

  router.get('/me', (req, res) => {
    if (!req.user) throw AppError.unauthorized();
    res.json({ user: req.user });
  });

  router.post('/logout', (req, res, next) => {
    req.logout((err) => {
      if (err) return next(err);
      req.session.destroy((destroyErr) => {
        if (destroyErr) return next(destroyErr);
        res.clearCookie('mendstep.sid', { path: '/' });
        res.status(204).end();
      });
    });
  });

  return router;
}
