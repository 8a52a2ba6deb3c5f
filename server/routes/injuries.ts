import { Router } from 'express';
import { z } from 'zod';
import { idParamsSchema } from '../../shared/ids';
import { injuryCreateSchema, injuryStatusSchema, injuryUpdateSchema, phaseOverrideBodySchema } from '../../shared/records/injury';
import { injuryCloseSchema, reinjurySchema } from '../../shared/records/injury';
import { recheckBodySchema } from '../../shared/clinic/recheck';
import { closeInjury, getClosure, recordReinjury } from '../services/injury-closure-service';
import { setRecheck } from '../services/recheck-service';
import { getReferralSummary } from '../services/referral-service';
import { measurementCreateSchema } from '../../shared/records/measurement';
import { currentUser, requireRole } from '../middleware/auth';
import { parseInput } from '../middleware/validate';
import { measurementsCsv } from '../services/csv-export-service';
import { sendCsv } from './review';
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
const referralQuerySchema = z.object({ runId: z.guid({ error: 'Run id must be a UUID' }).optional() });

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

  router.get('/:id/measurements.csv', async (req, res) => {
    const { id } = parseInput(idParamsSchema, req.params);
    sendCsv(res, await measurementsCsv(currentUser(req), id));
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

  router.put('/:id/recheck', async (req, res) => {
    const { id } = parseInput(idParamsSchema, req.params);
    const { nextRecheckAt } = parseInput(recheckBodySchema, req.body);
    res.json({ injury: await setRecheck(currentUser(req), id, nextRecheckAt) });
  });

  router.get('/:id/closure', async (req, res) => {
    const { id } = parseInput(idParamsSchema, req.params);
    res.json(await getClosure(currentUser(req), id));
  });

  router.post('/:id/close', async (req, res) => {
    const { id } = parseInput(idParamsSchema, req.params);
    res.json({ injury: await closeInjury(currentUser(req), id, parseInput(injuryCloseSchema, req.body)) });
  });

  router.post('/:id/reinjury', async (req, res) => {
    const { id } = parseInput(idParamsSchema, req.params);
    res.status(201).json({ injury: await recordReinjury(currentUser(req), id, parseInput(reinjurySchema, req.body)) });
  });

  router.get('/:id/referral', async (req, res) => {
    const { id } = parseInput(idParamsSchema, req.params);
    const { runId } = parseInput(referralQuerySchema, req.query);
    res.setHeader('Cache-Control', 'no-store');
    res.json({ referral: await getReferralSummary(currentUser(req), id, runId) });
  });

  return router;
}
