import { Router } from 'express';
import { z } from 'zod';
import { idParamsSchema } from '../../shared/ids';
import { logEntrySchema } from '../../shared/runs/log-entry';
import { screeningSchema } from '../../shared/runs/screening';
import { AppError } from '../errors';
import { currentUser, requireRole } from '../middleware/auth';
import { parseInput } from '../middleware/validate';
import { appendLogEntry, completeScreening, createRun, getRunDetail, listRunsForInjury, listRunsInProgress } from '../services/run-service';

const createRunSchema = z.object({
  injuryId: z.guid({ error: 'Injury id must be a UUID' }),
  screening: screeningSchema.optional(),
});
const screeningBodySchema = z.object({ screening: screeningSchema });
const listQuerySchema = z.object({ injuryId: z.guid({ error: 'Injury id must be a UUID' }) });
const inProgressQuerySchema = z.object({ injuryId: z.guid({ error: 'Injury id must be a UUID' }).optional() });
const idempotencyKeySchema = z.guid({ error: 'Idempotency-Key must be a UUID made when the entry was created' });

export function runRoutes(): Router {
  const router = Router();
  router.use(requireRole('therapist', 'supervisor'));

  router.post('/', async (req, res) => {
    const run = await createRun(currentUser(req), parseInput(createRunSchema, req.body));
    res.status(201).json({ run });
  });

  router.get('/', async (req, res) => {
    const { injuryId } = parseInput(listQuerySchema, req.query);
    res.json({ items: await listRunsForInjury(currentUser(req), injuryId) });
  });

  router.get('/in-progress', async (req, res) => {
    const { injuryId } = parseInput(inProgressQuerySchema, req.query);
    res.json({ items: await listRunsInProgress(currentUser(req), injuryId) });
  });

  router.get('/:id', async (req, res) => {
    const { id } = parseInput(idParamsSchema, req.params);
    res.json(await getRunDetail(currentUser(req), id));
  });

  router.put('/:id/screening', async (req, res) => {
    const { id } = parseInput(idParamsSchema, req.params);
    const { screening } = parseInput(screeningBodySchema, req.body);
    res.json({ run: await completeScreening(currentUser(req), id, screening) });
  });

  router.post('/:id/log', async (req, res) => {
    const { id } = parseInput(idParamsSchema, req.params);
    const keyCheck = idempotencyKeySchema.safeParse(req.get('Idempotency-Key'));
    if (!keyCheck.success) {
      throw AppError.badRequest('Send an Idempotency-Key header (a UUID made when the entry was created).', {
        'Idempotency-Key': keyCheck.error.issues[0].message,
      });
    }
    const entry = parseInput(logEntrySchema, req.body);
    const result = await appendLogEntry(currentUser(req), id, keyCheck.data.toLowerCase(), entry);
    res.status(result.created ? 201 : 200).json({ entry: result.entry });
  });

  return router;
}
