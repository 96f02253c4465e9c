import { Router } from 'express';
import { requireRole, scopeFromRequest } from '../auth/require-role';
import type { Db } from '../db/client';
import { clinicPseudonymSalt, listInstruments, listInterventions } from '../services/reference.service';

/** Reference data for forms and uploads (any signed-in role), and the clinic's pseudonym salt. */
export function referenceRoutes(db: Db): Router {
  const router = Router();
  const anyone = requireRole('steward', 'lead', 'clinician', 'researcher');

  router.get('/instruments', anyone, async (_req, res) => {
    const items = await listInstruments(db);
    res.json({ items, total: items.length });
  });
  router.get('/interventions', anyone, async (_req, res) => {
    const items = await listInterventions(db);
    res.json({ items, total: items.length });
  });
  router.get('/clinics/current/pseudonym-salt', requireRole('lead', 'clinician'), async (req, res) => {
    res.json(await clinicPseudonymSalt(db, scopeFromRequest(req)));
  });
  return router;
}
