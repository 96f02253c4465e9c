import { Router } from 'express';
import { z } from 'zod';
import type { Db } from '../db/client';
import type { Mailer } from '../mail/transport';
import { requireRole, scopeFromRequest } from '../auth/require-role';
import {
  DataRequestApproveSchema,
  DataRequestCreateSchema,
  DataRequestDeclineSchema,
  DictionaryQuerySchema,
} from '../../shared/schemas/data-request';
import {
  approveDataRequest,
  createDataRequest,
  declineDataRequest,
  listDataRequests,
} from '../services/exports/data-requests.service';
import { requestDictionary } from '../services/exports/dictionary';
import { listExports } from '../services/exports/export-log.service';
import { streamExport } from '../services/exports/stream-export';

const IdParam = z.object({ id: z.coerce.number().int().positive() });

/** Data requests, the steward's decisions, the de-identified download and the exports log. */
export function dataRequestRoutes(deps: { db: Db; mailer: Mailer; log: (m: string) => void }): Router {
  const { db } = deps;
  const router = Router();
  const registry = requireRole('researcher', 'steward');

  router.get('/data-requests', registry, async (req, res) => {
    res.json(await listDataRequests(db, scopeFromRequest(req)));
  });

  router.post('/data-requests', requireRole('researcher'), async (req, res) => {
    res.status(201).json(await createDataRequest(db, scopeFromRequest(req), DataRequestCreateSchema.parse(req.body)));
  });

  router.post('/data-requests/:id/approve', requireRole('steward'), async (req, res) => {
    const { id } = IdParam.parse(req.params);
    res.json(await approveDataRequest(db, scopeFromRequest(req), id, DataRequestApproveSchema.parse(req.body), deps));
  });

  router.post('/data-requests/:id/decline', requireRole('steward'), async (req, res) => {
    const { id } = IdParam.parse(req.params);
    const { reason } = DataRequestDeclineSchema.parse(req.body);
    res.json(await declineDataRequest(db, scopeFromRequest(req), id, reason, deps));
  });

  router.get('/data-requests/:id/dictionary', registry, async (req, res) => {
    const { id } = IdParam.parse(req.params);
    const { format } = DictionaryQuerySchema.parse(req.query);
    const d = await requestDictionary(db, scopeFromRequest(req), id, format);
    res.set({
      'content-type': d.contentType,
      'content-disposition': `attachment; filename="${d.filename}"`,
      'cache-control': 'no-store',
    });
    res.send(d.body);
  });

  router.get('/data-requests/:id/export.csv', registry, async (req, res) => {
    const { id } = IdParam.parse(req.params);
    try {
      await streamExport(
        db,
        scopeFromRequest(req),
        id,
        {
          out: res,
          begin: (m) => {
            res.status(200).set({
              'content-type': 'text/csv; charset=utf-8',
              'content-disposition': `attachment; filename="${m.exportName}.csv"`,
              'cache-control': 'no-store',
              'x-export-rows': String(m.expectedRows),
              'x-export-generalised-rows': String(m.generalisedRows),
              'x-export-suppressed-rows': String(m.suppressedRows),
              'x-export-k': String(m.k),
            });
          },
        },
        deps.log,
      );
    } catch (e) {
      // Once bytes have gone out the status is sent: cut the connection so the file is visibly incomplete.
      if (!res.headersSent) throw e;
      deps.log(`export of request ${id} failed mid-stream: ${e instanceof Error ? e.message : String(e)}`);
      res.destroy();
    }
  });

  router.get('/exports', requireRole('steward'), async (req, res) => {
    res.json(await listExports(db, scopeFromRequest(req)));
  });

  return router;
}
