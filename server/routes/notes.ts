import { Router } from 'express';
import { idParamsSchema } from '../../shared/ids';
import { reopenSchema, sessionNoteUpdateSchema, signOffSchema } from '../../shared/notes/schemas';
import { currentUser, requireRole } from '../middleware/auth';
import { parseInput } from '../middleware/validate';
import { getOrDraftNote, reopenNote, signOffNote, submitNote, updateNote } from '../services/session-note-service';

/**
 * A run's session note, under /api/runs/:id. Guards sit on each route rather than on the router, so the
 * other /runs routes are left to their own router.
 */
export function noteRoutes(): Router {
  const router = Router();
  const writers = requireRole('therapist', 'supervisor');
  const supervisors = requireRole('supervisor');

  router.get('/:id/note', writers, async (req, res) => {
    const { id } = parseInput(idParamsSchema, req.params);
    res.json({ note: await getOrDraftNote(currentUser(req), id) });
  });

  router.put('/:id/note', writers, async (req, res) => {
    const { id } = parseInput(idParamsSchema, req.params);
    res.json({ note: await updateNote(currentUser(req), id, parseInput(sessionNoteUpdateSchema, req.body)) });
  });

  router.post('/:id/note/submit', writers, async (req, res) => {
    const { id } = parseInput(idParamsSchema, req.params);
    res.json({ note: await submitNote(currentUser(req), id) });
  });

  router.post('/:id/sign-off', supervisors, async (req, res) => {
    const { id } = parseInput(idParamsSchema, req.params);
    const { comment } = parseInput(signOffSchema, req.body ?? {});
    res.json({ note: await signOffNote(currentUser(req), id, comment) });
  });

  router.post('/:id/note/reopen', supervisors, async (req, res) => {
    const { id } = parseInput(idParamsSchema, req.params);
    const { reason } = parseInput(reopenSchema, req.body ?? {});
    res.json({ note: await reopenNote(currentUser(req), id, reason) });
  });

  return router;
}
