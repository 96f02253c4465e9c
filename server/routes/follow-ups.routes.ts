import { Router, type Request } from 'express';
import { z } from 'zod';
import { ROLES } from '../../shared/roles';
import { todayUtc } from '../../shared/follow-up-schedule';
import type { Db } from '../db/client';
import { env } from '../env';
import { currentUser, requireRole, scopeFromRequest } from '../auth/require-role';
import { listFollowUps } from '../services/follow-ups.service';
import { completeness } from '../services/follow-ups-completeness.service';
import { lostProposals } from '../services/follow-ups-lost.service';
import { getPreferences, updatePreferences } from '../services/follow-ups-preferences.service';
import { createSelfReportLink } from '../services/self-report-links.service';

const IdParam = z.coerce.number().int().positive();

/** Where the patient's link points: the configured public address, else the address the clinician is using. */
function baseUrlOf(req: Request): string {
  return env().APP_URL ?? `${req.protocol}://${req.get('host') ?? '127.0.0.1'}`;
}

/** Due lists, completeness and lost proposals of the caller's clinic; self-report links; the digest preference. */
export function followUpRoutes(db: Db): Router {
  const router = Router();
  const clinicRoles = requireRole('lead', 'clinician');

  router.get('/follow-ups', clinicRoles, async (req, res) => {
    res.json(await listFollowUps(db, scopeFromRequest(req), req.query, todayUtc()));
  });

  router.get('/follow-ups/completeness', requireRole('lead'), async (req, res) => {
    res.json(await completeness(db, scopeFromRequest(req), todayUtc()));
  });

  router.get('/follow-ups/lost-proposals', requireRole('lead'), async (req, res) => {
    res.json(await lostProposals(db, scopeFromRequest(req), todayUtc()));
  });

  router.post('/episodes/:id/self-report-links', clinicRoles, async (req, res) => {
    const id = IdParam.parse(req.params.id);
    res.status(201).json(await createSelfReportLink(db, scopeFromRequest(req), id, req.body, baseUrlOf(req)));
  });

  router.get('/me/preferences', requireRole(...ROLES), async (req, res) => {
    res.json(await getPreferences(db, currentUser(req).id));
  });

  router.patch('/me/preferences', requireRole(...ROLES), async (req, res) => {
    res.json(await updatePreferences(db, currentUser(req).id, req.body));
  });

  return router;
}
