import { Router, type Request, type Response } from 'express';
import { z } from 'zod';
import { AnalyticsFiltersSchema } from '../../shared/schemas/analytics-filters';
import type { Db } from '../db/client';
import { currentUser, requireRole, scopeFromRequest } from '../auth/require-role';
import { runAnalytics, runTrajectory, type AnalyticsEndpoint } from '../services/analytics';

const EpisodeIdSchema = z.coerce.number().int().positive();

function send(res: Response, out: { body: unknown; hit: boolean }): void {
  // Health data: never kept by a shared cache; x-analytics-cache says whether the numbers were reused.
  res
    .set('cache-control', 'private, no-store')
    .set('x-analytics-cache', out.hit ? 'hit' : 'miss')
    .json(out.body);
}

/** GET /api/analytics/*: every endpoint takes the same filters and is scoped by role and clinic. */
export function analyticsRoutes(db: Db): Router {
  const router = Router();
  const endpoint = (name: AnalyticsEndpoint) => async (req: Request, res: Response) => {
    const filters = AnalyticsFiltersSchema.parse(req.query);
    send(res, await runAnalytics(db, scopeFromRequest(req), currentUser(req), name, filters));
  };
  router.get('/analytics/outcomes', requireRole('lead', 'clinician', 'steward'), endpoint('outcomes'));
  router.get('/analytics/recovery', requireRole('lead', 'clinician', 'steward', 'researcher'), endpoint('recovery'));
  router.get('/analytics/addons', requireRole('lead', 'clinician', 'researcher'), endpoint('addons'));
  router.get('/analytics/clinics', requireRole('lead', 'steward', 'researcher'), endpoint('clinics'));
  router.get('/analytics/episodes/:id/trajectory', requireRole('lead', 'clinician', 'steward'), async (req, res) => {
    const id = EpisodeIdSchema.parse(req.params.id);
    const filters = AnalyticsFiltersSchema.parse(req.query);
    send(res, await runTrajectory(db, scopeFromRequest(req), currentUser(req), id, filters));
  });
  return router;
}
