import { Router } from 'express';
import { InstrumentCreateSchema, InstrumentPatchSchema, McidUpdateSchema } from '../../shared/schemas/admin';
import type { Db } from '../db/client';
import { requireRole, scopeFromRequest } from '../auth/require-role';
import {
  createInstrument, deleteInstrument, listInstruments, setMcid, setRetired, updateInstrument,
} from '../services/admin/instruments';
import { IdParamSchema as IdParam } from '../../shared/schemas/admin';

export function adminInstrumentRoutes(db: Db): Router {
  const router = Router();
  router.use('/admin/instruments', requireRole('steward'));

  router.get('/admin/instruments', async (req, res) => {
    res.json(await listInstruments(db, scopeFromRequest(req)));
  });
  router.post('/admin/instruments', async (req, res) => {
    res.status(201).json(await createInstrument(db, scopeFromRequest(req), InstrumentCreateSchema.parse(req.body)));
  });
  router.patch('/admin/instruments/:id', async (req, res) => {
    const { id } = IdParam.parse(req.params);
    res.json(await updateInstrument(db, scopeFromRequest(req), id, InstrumentPatchSchema.parse(req.body)));
  });
  router.put('/admin/instruments/:id/mcid', async (req, res) => {
    const { id } = IdParam.parse(req.params);
    res.json(await setMcid(db, scopeFromRequest(req), id, McidUpdateSchema.parse(req.body)));
  });
  router.post('/admin/instruments/:id/retire', async (req, res) => {
    res.json(await setRetired(db, scopeFromRequest(req), IdParam.parse(req.params).id, true));
  });
  router.post('/admin/instruments/:id/reinstate', async (req, res) => {
    res.json(await setRetired(db, scopeFromRequest(req), IdParam.parse(req.params).id, false));
  });
  router.delete('/admin/instruments/:id', async (req, res) => {
    await deleteInstrument(db, scopeFromRequest(req), IdParam.parse(req.params).id);
    res.status(204).end();
  });
  return router;
}
