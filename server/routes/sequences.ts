import { Router } from 'express';
import { sequenceSchema } from '../../shared/plan/sequence';
import { currentUser, requireRole } from '../middleware/auth';
import { parseInput } from '../middleware/validate';
import { listCurrentSequences, saveSequence } from '../services/sequence-service';

export function sequenceRoutes(): Router {
  const router = Router();

  router.get('/', requireRole('therapist', 'supervisor', 'admin'), async (req, res) => {
    res.json({ items: await listCurrentSequences(currentUser(req)) });
  });

  // Sequences are the clinic's protocol: only supervisors change them, within the schema's safety bounds.
  router.put('/', requireRole('supervisor'), async (req, res) => {
    res.json({ sequence: await saveSequence(currentUser(req), parseInput(sequenceSchema, req.body)) });
  });

  return router;
}
