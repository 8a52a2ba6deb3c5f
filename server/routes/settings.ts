import { Router } from 'express';
import { settingsBodySchema } from '../../shared/clinic/settings';
import { currentUser, requireRole } from '../middleware/auth';
import { parseInput } from '../middleware/validate';
import { getSettings, updateSettings } from '../services/settings-service';

/** The clinic's settings: admins only. */
export function settingsRoutes(): Router {
  const router = Router();
  router.use(requireRole('admin'));

  router.get('/', async (req, res) => {
    res.json(await getSettings(currentUser(req)));
  });

  router.put('/', async (req, res) => {
    res.json(await updateSettings(currentUser(req), parseInput(settingsBodySchema, req.body)));
  });

  return router;
}
