import { Router, type Response } from 'express';
import { idParamsSchema } from '../../shared/ids';
import { adherenceQuerySchema, reviewFilterSchema, reviewRunsQuerySchema } from '../../shared/review/query';
import { currentUser, requireRole } from '../middleware/auth';
import { parseInput } from '../middleware/validate';
import { getAdherence } from '../services/adherence-service';
import { reviewRunsCsv, type CsvFile } from '../services/csv-export-service';
import { getReviewFilters, getReviewRunDetail, listReviewRuns } from '../services/review-service';

export function sendCsv(res: Response, file: CsvFile): void {
  res.setHeader('Content-Type', 'text/csv; charset=utf-8');
  res.setHeader('Content-Disposition', `attachment; filename="${file.filename}"`);
  res.setHeader('Cache-Control', 'no-store');
  res.send(file.body);
}

/** The review desk: supervisors and admins of the clinic; therapists are refused. */
export function reviewRoutes(): Router {
  const router = Router();
  router.use(requireRole('supervisor', 'admin'));

  router.get('/filters', async (req, res) => {
    res.json(await getReviewFilters(currentUser(req)));
  });

  // Before /runs/:id, so "runs.csv" is never read as a run id.
  router.get('/runs.csv', async (req, res) => {
    sendCsv(res, await reviewRunsCsv(currentUser(req), parseInput(reviewFilterSchema, req.query)));
  });

  router.get('/runs', async (req, res) => {
    res.json(await listReviewRuns(currentUser(req), parseInput(reviewRunsQuerySchema, req.query)));
  });

  router.get('/runs/:id', async (req, res) => {
    const { id } = parseInput(idParamsSchema, req.params);
    res.json(await getReviewRunDetail(currentUser(req), id));
  });

  router.get('/adherence', async (req, res) => {
    res.json(await getAdherence(currentUser(req), parseInput(adherenceQuerySchema, req.query)));
  });

  return router;
}
