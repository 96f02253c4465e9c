import { Router } from 'express';
import { ClinicCreateSchema, ClinicPatchSchema } from '../../shared/schemas/admin';
import type { Db } from '../db/client';
import { requireRole, scopeFromRequest } from '../auth/require-role';
import { createClinic, getClinic, listClinics, setClinicActive, updateClinic } from '../services/admin/clinics';
import { IdParamSchema as IdParam } from '../../shared/schemas/admin';

export function adminClinicRoutes(db: Db): Router {
  const router = Router();
  router.use('/admin/clinics', requireRole('steward'));

  router.get('/admin/clinics', async (req, res) => {
    res.json(await listClinics(db, scopeFromRequest(req)));
  });
  router.get('/admin/clinics/:id', async (req, res) => {
    res.json(await getClinic(db, scopeFromRequest(req), IdParam.parse(req.params).id));
  });
  router.post('/admin/clinics', async (req, res) => {
    res.status(201).json(await createClinic(db, scopeFromRequest(req), ClinicCreateSchema.parse(req.body)));
  });
  router.patch('/admin/clinics/:id', async (req, res) => {
    const { id } = IdParam.parse(req.params);
    res.json(await updateClinic(db, scopeFromRequest(req), id, ClinicPatchSchema.parse(req.body)));
  });
  router.post('/admin/clinics/:id/deactivate', async (req, res) => {
    res.json(await setClinicActive(db, scopeFromRequest(req), IdParam.parse(req.params).id, false));
  });
  router.post('/admin/clinics/:id/reactivate', async (req, res) => {
    res.json(await setClinicActive(db, scopeFromRequest(req), IdParam.parse(req.params).id, true));
  });
  return router;
}
