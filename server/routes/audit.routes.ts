import { Router } from 'express';
import { AuditQuerySchema } from '../../shared/schemas/admin';
import type { Db } from '../db/client';
import { requireRole, scopeFromRequest } from '../auth/require-role';
import { auditCsv } from '../services/admin/audit-csv';
import { auditFacets, listAudit } from '../services/admin/audit-query';

/** The steward reads the whole trail; a clinic lead the events of their clinic (the service applies the scope). */
export function auditRoutes(db: Db): Router {
  const router = Router();
  router.use('/audit', requireRole('steward', 'lead'));

  router.get('/audit', async (req, res) => {
    res.json(await listAudit(db, scopeFromRequest(req), AuditQuerySchema.parse(req.query)));
  });
  router.get('/audit/facets', async (req, res) => {
    res.json(await auditFacets(db, scopeFromRequest(req)));
  });
  router.get('/audit/export.csv', async (req, res) => {
    const { limit: _l, offset: _o, ...filter } = AuditQuerySchema.parse(req.query);
    const { csv } = await auditCsv(db, scopeFromRequest(req), filter);
    const day = new Date().toISOString().slice(0, 10);
    res
      .type('text/csv; charset=utf-8')
      .set('content-disposition', `attachment; filename="loadline-audit-${day}.csv"`)
      .set('cache-control', 'no-store')
      .send(csv);
  });
  return router;
}
