import { Router } from 'express';
import { CodeCreateSchema, CodeDecisionSchema, CodePatchSchema, CodeProposalSchema } from '../../shared/schemas/admin';
import type { Db } from '../db/client';
import { requireRole, scopeFromRequest } from '../auth/require-role';
import { createCode, decideProposal, listCodes, proposeCode, updateCode } from '../services/admin/codes';
import { IdParamSchema as IdParam } from '../../shared/schemas/admin';

/** The steward keeps the code list; a clinic lead proposes the clinic's own codes and sees their fate. */
export function adminCodeRoutes(db: Db): Router {
  const router = Router();
  router.use('/admin/intervention-codes', requireRole('steward'));

  router.get('/admin/intervention-codes', async (req, res) => {
    res.json(await listCodes(db, scopeFromRequest(req)));
  });
  router.post('/admin/intervention-codes', async (req, res) => {
    res.status(201).json(await createCode(db, scopeFromRequest(req), CodeCreateSchema.parse(req.body)));
  });
  router.patch('/admin/intervention-codes/:id', async (req, res) => {
    const { id } = IdParam.parse(req.params);
    res.json(await updateCode(db, scopeFromRequest(req), id, CodePatchSchema.parse(req.body)));
  });
  router.post('/admin/intervention-codes/:id/decision', async (req, res) => {
    const { id } = IdParam.parse(req.params);
    res.json(await decideProposal(db, scopeFromRequest(req), id, CodeDecisionSchema.parse(req.body)));
  });

  router.get('/intervention-codes/proposals', requireRole('lead'), async (req, res) => {
    res.json(await listCodes(db, scopeFromRequest(req)));
  });
  router.post('/intervention-codes/proposals', requireRole('lead'), async (req, res) => {
    res.status(201).json(await proposeCode(db, scopeFromRequest(req), CodeProposalSchema.parse(req.body)));
  });
  return router;
}
