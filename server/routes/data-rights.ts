import { Router } from 'express';
import { dataRightsSearchSchema, eraseAthleteSchema } from '../../shared/data-rights/data-rights';
import { idParamsSchema } from '../../shared/ids';
import { currentUser, requireRole } from '../middleware/auth';
import { parseInput } from '../middleware/validate';
import type { FileStorage } from '../storage';
import { eraseAthlete, exportAthlete, searchDataRightsAthletes } from '../services/data-rights-service';

/**
 * Admins answer an athlete's data requests. Mounted at the API's root, before the athletes router, whose
 * clinical-staff guard would otherwise turn admins away from /athletes/… paths.
 */
export function dataRightsRoutes(storage: FileStorage): Router {
  const router = Router();
  const admin = requireRole('admin');

  router.get('/data-rights/athletes', admin, async (req, res) => {
    res.json({ items: await searchDataRightsAthletes(currentUser(req), parseInput(dataRightsSearchSchema, req.query)) });
  });

  router.get('/athletes/:id/export', admin, async (req, res) => {
    const { id } = parseInput(idParamsSchema, req.params);
    const exported = await exportAthlete(currentUser(req), storage, id);
    res.attachment(exported.filename);
    res.setHeader('Content-Type', 'application/zip');
    res.setHeader('Cache-Control', 'private, no-store');
    res.setHeader('X-Content-Type-Options', 'nosniff');
    try {
      await exported.writeTo(res);
    } catch (error) {
      // Headers (and part of the zip) are already out: cut the download short rather than send a broken file whole.
      req.log.error({ err: error }, 'athlete export failed');
      res.destroy(error as Error);
    }
  });

  router.post('/athletes/:id/erase', admin, async (req, res) => {
    const { id } = parseInput(idParamsSchema, req.params);
    res.json(await eraseAthlete(currentUser(req), storage, id, parseInput(eraseAthleteSchema, req.body)));
  });

  return router;
}
