import { Router } from 'express';
import { auditFilterSchema, auditQuerySchema } from '../../shared/audit/query';
import { currentUser, requireRole } from '../middleware/auth';
import { parseInput } from '../middleware/validate';
import { auditCsv, getAuditFilters, listAuditEvents } from '../services/audit-query-service';

/** The audit viewer: admins and supervisors of the clinic. */
export function auditRoutes(): Router {
  const router = Router();
  router.use(requireRole('admin', 'supervisor'));

  router.get('/filters', async (req, res) => {
    res.json(await getAuditFilters(currentUser(req)));
  });

  router.get('/events', async (req, res) => {
    res.json(await listAuditEvents(currentUser(req), parseInput(auditQuerySchema, req.query)));
  });

  router.get('/events.csv', async (req, res) => {
    const file = await auditCsv(currentUser(req), parseInput(auditFilterSchema, req.query));
    res.setHeader('Content-Type', 'text/csv; charset=utf-8');
    res.setHeader('Content-Disposition', `attachment; filename="${file.filename}"`);
    res.setHeader('Cache-Control', 'no-store');
    res.send(file.body);
  });

  return router;
}
