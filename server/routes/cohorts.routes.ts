import { Router } from 'express';
import { z } from 'zod';
import type { Db } from '../db/client';
import { requireRole, scopeFromRequest } from '../auth/require-role';
import { CohortDuplicateSchema, CohortPreviewInputSchema, CohortSaveSchema } from '../../shared/schemas/cohort';
import {
  createCohort,
  duplicateCohort,
  getCohort,
  listCohorts,
  saveCohortVersion,
} from '../services/cohorts/cohorts.service';
import { previewCohort } from '../services/cohorts/preview.service';

const IdParam = z.object({ id: z.coerce.number().int().positive() });

/** Cohort builder: researchers and the steward only (clinic roles get 403). */
export function cohortRoutes(db: Db): Router {
  const router = Router();
  const allowed = requireRole('researcher', 'steward');

  router.get('/cohorts', allowed, async (req, res) => {
    res.json(await listCohorts(db, scopeFromRequest(req)));
  });

  router.post('/cohorts/preview', allowed, async (req, res) => {
    const { criteria } = CohortPreviewInputSchema.parse(req.body);
    res.json(await previewCohort(db, scopeFromRequest(req), criteria));
  });

  router.post('/cohorts', allowed, async (req, res) => {
    res.status(201).json(await createCohort(db, scopeFromRequest(req), CohortSaveSchema.parse(req.body)));
  });

  router.get('/cohorts/:id', allowed, async (req, res) => {
    const { id } = IdParam.parse(req.params);
    res.json(await getCohort(db, scopeFromRequest(req), id));
  });

  router.put('/cohorts/:id', allowed, async (req, res) => {
    const { id } = IdParam.parse(req.params);
    res.json(await saveCohortVersion(db, scopeFromRequest(req), id, CohortSaveSchema.parse(req.body)));
  });

  router.post('/cohorts/:id/duplicate', allowed, async (req, res) => {
    const { id } = IdParam.parse(req.params);
    const { name } = CohortDuplicateSchema.parse(req.body ?? {});
    res.status(201).json(await duplicateCohort(db, scopeFromRequest(req), id, name));
  });

  return router;
}
