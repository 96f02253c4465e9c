import type { SessionUser } from '../../../shared/auth';
import { canonicalFilters, type AnalyticsFilters } from '../../../shared/schemas/analytics-filters';
import type { Db } from '../../db/client';
import type { Scope } from '../../db/scope';
import { cachedByDataVersion } from '../cache';
import { addOnSignals } from './addons.service';
import { clinicFunnels, presentClinics } from './clinics.service';
import { buildContext } from './context';
import { clinicOutcomes } from './outcomes.service';
import { recoveryBySubgroup } from './recovery.service';
import { episodeTrajectory } from './trajectory.service';

export type AnalyticsEndpoint = 'outcomes' | 'recovery' | 'addons' | 'clinics';

/**
 * Runs one analytics endpoint through the cache: the key holds everything the answer depends on
 * (endpoint, role, the caller's clinic, the canonical filters) and the data version is added by the cache.
 */
export async function runAnalytics(
  db: Db,
  scope: Scope,
  user: SessionUser,
  endpoint: AnalyticsEndpoint,
  filters: AnalyticsFilters,
) {
  const who = scope.kind === 'clinic' ? `clinic:${scope.clinicId}` : scope.researcher ? 'research' : 'registry';
  const key = `${endpoint}|${user.role}|${who}|${canonicalFilters(filters)}`;
  const { value, hit } = await cachedByDataVersion(db, key, async (dataVersion) => {
    const ctx = await buildContext(db, scope, user.role, filters);
    switch (endpoint) {
      case 'outcomes':
        return clinicOutcomes(db, ctx, dataVersion);
      case 'recovery':
        return recoveryBySubgroup(db, ctx, dataVersion);
      case 'addons':
        return addOnSignals(db, ctx, dataVersion);
      case 'clinics':
        return clinicFunnels(db, ctx, dataVersion);
    }
  });
  // The peer comparison's anonymous labels are drawn per request, after the cache.
  const body =
    endpoint === 'clinics' ? presentClinics(value as Awaited<ReturnType<typeof clinicFunnels>>, scope) : value;
  return { body, hit };
}

export async function runTrajectory(
  db: Db,
  scope: Scope,
  user: SessionUser,
  episodeId: number,
  filters: AnalyticsFilters,
) {
  const who = scope.kind === 'clinic' ? `clinic:${scope.clinicId}` : scope.researcher ? 'research' : 'registry';
  const key = `trajectory:${episodeId}|${user.role}|${who}|${canonicalFilters({ ...filters, clinic: undefined })}`;
  const { value, hit } = await cachedByDataVersion(db, key, async (dataVersion) => {
    const ctx = await buildContext(db, scope, user.role, { ...filters, clinic: undefined });
    return episodeTrajectory(db, scope, ctx, dataVersion, episodeId);
  });
  return { body: value, hit };
}
