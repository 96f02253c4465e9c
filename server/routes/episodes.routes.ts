import { Router } from 'express';
import {
  AssessmentInputSchema, EpisodeCreateSchema, EpisodeListQuerySchema, EpisodePatchSchema, InterventionsPutSchema,
} from '../../shared/schemas/episode';
import { requireRole, scopeFromRequest } from '../auth/require-role';
import type { Db } from '../db/client';
import { addAssessment, setInterventions } from '../services/episodes-assessments.service';
import { episodeId } from '../services/episodes-scope';
import { getEpisode, listEpisodes } from '../services/episodes.service';
import { createEpisode, patchEpisode } from '../services/episodes-write.service';

/** Episodes of care: read by the clinic and the steward, written by the clinic; never by researchers. */
export function episodeRoutes(db: Db): Router {
  const router = Router();
  const read = requireRole('lead', 'clinician', 'steward');
  const write = requireRole('lead', 'clinician');

  router.get('/episodes', read, async (req, res) => {
    res.json(await listEpisodes(db, scopeFromRequest(req), EpisodeListQuerySchema.parse(req.query)));
  });
  router.post('/episodes', write, async (req, res) => {
    res.status(201).json(await createEpisode(db, scopeFromRequest(req), EpisodeCreateSchema.parse(req.body)));
  });
  router.get('/episodes/:id', read, async (req, res) => {
    res.json(await getEpisode(db, scopeFromRequest(req), episodeId(req.params.id)));
  });
  router.patch('/episodes/:id', write, async (req, res) => {
    const id = episodeId(req.params.id);
    res.json(await patchEpisode(db, scopeFromRequest(req), id, EpisodePatchSchema.parse(req.body)));
  });
  router.post('/episodes/:id/assessments', write, async (req, res) => {
    const id = episodeId(req.params.id);
    res.status(201).json(await addAssessment(db, scopeFromRequest(req), id, AssessmentInputSchema.parse(req.body)));
  });
  router.put('/episodes/:id/interventions', write, async (req, res) => {
    const id = episodeId(req.params.id);
    res.json(await setInterventions(db, scopeFromRequest(req), id, InterventionsPutSchema.parse(req.body)));
  });
  return router;
}
