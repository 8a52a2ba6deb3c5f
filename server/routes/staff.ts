import { Router } from 'express';
import { idParamsSchema } from '../../shared/ids';
import { AppError } from '../errors';
import { currentUser, requireRole } from '../middleware/auth';
import { parseInput } from '../middleware/validate';
import { getStaffMember, listStaff } from '../services/staff-service';
import { updateStaffMember } from '../services/staff-admin-service';
import { staffUpdateSchema } from '../../shared/staff/schemas';
import { invitationRoutes } from './invitations';
import { resendInvitation } from '../services/invitation-service';

export function staffRoutes(): Router {
  const router = Router();
  router.use(requireRole('admin'));
  router.use('/invitations', invitationRoutes());

  router.get('/', async (req, res) => {
    res.json({ staff: await listStaff(currentUser(req)) });
  });

  router.get('/:id', async (req, res) => {
    const { id } = parseInput(idParamsSchema, req.params);
    const member = await getStaffMember(currentUser(req), id);
    if (!member) throw AppError.notFound('Staff member');
    res.json({ member });
  });

  router.patch('/:id', async (req, res) => {
    const { id } = parseInput(idParamsSchema, req.params);
    res.json({ member: await updateStaffMember(currentUser(req), id, parseInput(staffUpdateSchema, req.body)) });
  });

  // A new link for someone invited who has not yet set a password; the earlier links stop working.
  router.post('/:id/invitation', async (req, res) => {
    const { id } = parseInput(idParamsSchema, req.params);
    res.status(201).json(await resendInvitation(currentUser(req), id));
  });

  return router;
}
