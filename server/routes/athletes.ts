import { Router } from 'express';
import { idParamsSchema } from '../../shared/ids';
import { athleteCreateSchema, athleteListQuerySchema, athleteUpdateSchema } from '../../shared/records/athlete';
import { currentUser, requireRole } from '../middleware/auth';
import { parseInput } from '../middleware/validate';
import { createAthlete, findAthlete, listAthletes, toAthleteView, updateAthlete } from '../services/athlete-service';
import { listInjuries } from '../services/injury-service';

// Clinical records are for the people who treat and supervise; admins manage staff and settings.
const clinicalStaff = requireRole('therapist', 'supervisor');

export function athleteRoutes(): Router {
  const router = Router();
  router.use(clinicalStaff);

  router.get('/', async (req, res) => {
    res.json(await listAthletes(currentUser(req), parseInput(athleteListQuerySchema, req.query)));
  });

  router.post('/', async (req, res) => {
    const athlete = await createAthlete(currentUser(req), parseInput(athleteCreateSchema, req.body));
    res.status(201).json({ athlete });
  });

  router.get('/:id', async (req, res) => {
    const actor = currentUser(req);
    const { id } = parseInput(idParamsSchema, req.params);
    const athlete = await toAthleteView(await findAthlete(actor, id));
    res.json({ athlete, injuries: await listInjuries(actor, { athleteId: id }) });
  });

  router.patch('/:id', async (req, res) => {
    const { id } = parseInput(idParamsSchema, req.params);
    res.json({ athlete: await updateAthlete(currentUser(req), id, parseInput(athleteUpdateSchema, req.body)) });
  });

  return router;
}
