import { Router } from 'express';
import { invitationSchema } from '../../shared/mail/account-schemas';
import { currentUser, requireRole } from '../middleware/auth';
import { parseInput } from '../middleware/validate';
import { inviteStaff } from '../services/invitation-service';

/** Mounted under /api/staff: admins invite staff by e-mail. */
export function invitationRoutes(): Router {
  const router = Router();
  router.post('/', requireRole('admin'), async (req, res) => {
    const result = await inviteStaff(currentUser(req), parseInput(invitationSchema, req.body));
    res.status(201).json(result);
  });
  return router;
}
