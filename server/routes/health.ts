import { Router } from 'express';
import type pg from 'pg';
import { checkHealth } from '../services/health-service';

/**
 * GET /healthz for load balancers and process managers: outside /api, no session, no CSRF, no sign-in.
 * 200 while the database answers, 503 when it does not; never cached.
 */
export function healthRoutes(pool: pg.Pool): Router {
  const router = Router();
  router.get('/healthz', async (_req, res) => {
    const health = await checkHealth(pool);
    res.setHeader('Cache-Control', 'no-store');
    res.status(health.ok ? 200 : 503).json(health);
  });
  return router;
}
