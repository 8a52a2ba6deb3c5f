import { Router } from 'express';
import { z } from 'zod';
import { idParamsSchema } from '../../shared/ids';
import { injuryCreateSchema, injuryStatusSchema, injuryUpdateSchema, phaseOverrideBodySchema } from '../../shared/records/injury';
import { measurementCreateSchema } from '../../shared/records/measurement';
import { currentUser, requireRole } from '../middleware/auth';
import { parseInput } from '../middleware/validate';
import {
  addMeasurement,
  createInjury,
  getInjuryDetail,
  listInjuries,
  listMeasurements,
  setPhaseOverride,
  updateInjury,
} from '../services/injury-service';

const listQuerySchema = z.object({ status: injuryStatusSchema.default('open') });

export function injuryRoutes(): Router {
  const router = Router();
  router.use(requireRole('therapist', 'supervisor'));

  router.get('/', async (req, res) => {
    const { status } = parseInput(listQuerySchema, req.query);
    res.json({ items: await listInjuries(currentUser(req), { status }) });
  });

  router.post('/', async (req, res) => {
    const injury = await createInjury(currentUser(req), parseInput(injuryCreateSchema, req.body));
    res.status(201).json({ injury });
  });

  router.get('/:id', async (req, res) => {
    const { id } = parseInput(idParamsSchema, req.params);
    res.json(await getInjuryDetail(currentUser(req), id));
  });

  router.patch('/:id', async (req, res) => {
    const { id } = parseInput(idParamsSchema, req.params);
    res.json({ injury: await updateInjury(currentUser(req), id, parseInput(injuryUpdateSchema, req.body)) });
  });

  router.put('/:id/phase-override', async (req, res) => {
    const { id } = parseInput(idParamsSchema, req.params);
    const { override } = parseInput(phaseOverrideBodySchema, req.body);
    res.json({ injury: await setPhaseOverride(currentUser(req), id, override) });
  });

  router.get('/:id/measurements', async (req, res) => {
    const { id } = parseInput(idParamsSchema, req.params);
    res.json({ items: await listMeasurements(currentUser(req), id) });
  });

  router.post('/:id/measurements', async (req, res) => {
    const { id } = parseInput(idParamsSchema, req.params);
    const result = await addMeasurement(currentUser(req), id, parseInput(measurementCreateSchema, req.body));
    res.status(201).json(result);
  });

  return router;
}
