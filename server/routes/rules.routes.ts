import { Router } from 'express';
import { RulesUpdateSchema } from '../../shared/schemas/admin';
import { ROLES } from '../../shared/roles';
import type { Db } from '../db/client';
import { requireRole, scopeFromRequest } from '../auth/require-role';
import { publicCurrentRules, rulesHistory, updateRules } from '../services/admin/rules';

export function rulesRoutes(db: Db): Router {
  const router = Router();
  // Every signed-in role: dashboards name the rules version behind their numbers.
  router.get('/rules/current', requireRole(...ROLES), async (_req, res) => {
    res.json(await publicCurrentRules(db));
  });
  router.get('/admin/rules', requireRole('steward'), async (req, res) => {
    res.json(await rulesHistory(db, scopeFromRequest(req)));
  });
  router.put('/admin/rules', requireRole('steward'), async (req, res) => {
    res.json(await updateRules(db, scopeFromRequest(req), RulesUpdateSchema.parse(req.body)));
  });
  return router;
}
