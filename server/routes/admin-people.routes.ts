import { Router } from 'express';
import { PeopleQuerySchema, PersonPatchSchema } from '../../shared/schemas/admin';
import type { Db } from '../db/client';
import { requireRole, scopeFromRequest } from '../auth/require-role';
import { listPeople, updatePerson } from '../services/admin/people';
import { IdParamSchema as IdParam } from '../../shared/schemas/admin';

/** Listing is scoped (a lead sees their clinic's clinicians); role and clinic changes are the steward's. */
export function adminPeopleRoutes(db: Db): Router {
  const router = Router();
  router.get('/admin/people', requireRole('steward', 'lead'), async (req, res) => {
    res.json(await listPeople(db, scopeFromRequest(req), PeopleQuerySchema.parse(req.query)));
  });
  router.patch('/admin/people/:id', requireRole('steward'), async (req, res) => {
    const { id } = IdParam.parse(req.params);
    res.json(await updatePerson(db, scopeFromRequest(req), id, PersonPatchSchema.parse(req.body)));
  });
  return router;
}
