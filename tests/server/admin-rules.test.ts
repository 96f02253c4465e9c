import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { asc, eq } from 'drizzle-orm';
import { kaplanMeier, recoveredShareAt, recoveryObservation, type Obs } from '../../analysis/index';
import { assessments, episodes, registryRules, scores } from '../../server/db/schema';
import { loadEpisodeTuples } from '../../server/services/analytics/episode-tuples';
import { recoveryObs } from '../../server/services/analytics/tuple-inputs';
import { readDataVersion } from '../../server/services/cache';
import { currentRules, rulesAt, type VersionedRules } from '../../server/services/rules.service';
import { DEFAULT_RULES, type RegistryRules } from '../../shared/rules';
import { testApp } from '../setup/test-app';
import { createClinic, createUser, signedInClient, type Client } from '../setup/auth';
import { auditCountBy, daysAgo, insertEpisode, instrumentId } from './admin-fixtures';

const ctx = testApp();
let stewardId: number;
let steward: Client;
let clinicId: number;

beforeAll(async () => {
  const s = await createUser(ctx.db, 'steward');
  stewardId = s.id;
  steward = await signedInClient(ctx.app, s.email);
  clinicId = (await createClinic(ctx.db, 'Rules test clinic')).id;
  // A tiny invented dataset, first-step pain (0–10) at weeks 0, 4, 6 and 12.
  const p = (weeks: number, value: number, timepoint: 'baseline' | 'week6' | 'week12' | 'interim') => ({ weeks, timepoint, scores: { 'nprs-first-step': value } });
  await insertEpisode(ctx.db, clinicId, daysAgo(200), [p(0, 8, 'baseline'), p(6, 2, 'week6'), p(12, 1, 'week12')]);
  await insertEpisode(ctx.db, clinicId, daysAgo(200), [p(0, 7, 'baseline'), p(6, 4, 'week6'), p(12, 2, 'week12')]);
  await insertEpisode(ctx.db, clinicId, daysAgo(200), [p(0, 6, 'baseline'), p(6, 1, 'week6')]);
  await insertEpisode(ctx.db, clinicId, daysAgo(200), [p(0, 9, 'baseline'), p(6, 5, 'week6'), p(12, 3, 'week12')]);
  await insertEpisode(ctx.db, clinicId, daysAgo(200), [p(0, 7, 'baseline'), p(4, 3, 'interim')]);
});

// Put the shipped values back, so later test files of the run see the defaults again.
afterAll(async () => {
  const now = await currentRules(ctx.db);
  if (JSON.stringify(now.rules) !== JSON.stringify(DEFAULT_RULES)) {
    await steward.put('/api/admin/rules').send({ rules: DEFAULT_RULES, reason: 'Test file restores the shipped defaults' });
  }
  await ctx.close();
});

const withThreshold = (r: RegistryRules, threshold: number): RegistryRules => ({ ...r, recovery: { ...r.recovery, threshold } });

/** Share recovered by week 12 through the analytics' own SQL reduction, under one rules version. */
async function shareAt12ViaAnalytics(v: VersionedRules): Promise<number | null> {
  const tuples = await loadEpisodeTuples(ctx.db, {
    cohort: { clinicId, consentingOnly: false, activeClinicsOnly: false, filters: { instrument: 'nprs-first-step', groupBy: 'activity' } },
    ownClinicId: null,
    recovery: { instrumentId: await instrumentId(ctx.db, v.rules.recovery.instrumentCode), threshold: v.rules.recovery.threshold, atLeast: false },
  });
  const obs = tuples.map(recoveryObs).filter((o): o is Obs => o !== null);
  return recoveredShareAt(kaplanMeier(obs), 12).estimate;
}

/** The same from plain rows and the analysis/ functions (recoveryObservation, kaplanMeier). */
async function shareAt12FromRows(v: VersionedRules): Promise<number | null> {
  const rows = await ctx.db
    .select({ episodeId: episodes.id, start: episodes.startDate, on: assessments.assessedOn, value: scores.value })
    .from(scores)
    .innerJoin(assessments, eq(assessments.id, scores.assessmentId))
    .innerJoin(episodes, eq(episodes.id, assessments.episodeId))
    .where(eq(episodes.clinicId, clinicId))
    .orderBy(asc(episodes.id));
  const series = new Map<number, { weeks: number; value: number }[]>();
  for (const r of rows) {
    const weeks = (Date.parse(r.on) - Date.parse(r.start)) / (7 * 86_400_000);
    series.set(r.episodeId, [...(series.get(r.episodeId) ?? []), { weeks, value: r.value }]);
  }
  const rule = { threshold: v.rules.recovery.threshold, direction: 'atMost' as const };
  const obs = [...series.values()].map((s) => recoveryObservation(s, rule)!);
  return recoveredShareAt(kaplanMeier(obs), 12).estimate;
}

describe('registry rules: versions, validation, recomputation', () => {
  it('refuses a change without a reason, with export k below 3, with a missing setting or an unknown instrument; stores nothing', async () => {
    const { rules } = await currentRules(ctx.db);
    const count = async () => (await ctx.db.select().from(registryRules)).length;
    const before = await count();
    const auditBefore = await auditCountBy(ctx.db, stewardId, 'registry-rules');
    const noReason = await steward.put('/api/admin/rules').send({ rules: withThreshold(rules, 1) });
    expect(noReason.status).toBe(422);
    expect(noReason.body.error.issues[0].path).toEqual(['reason']);
    const lowK = await steward.put('/api/admin/rules').send({ rules: { ...rules, exportK: 2 }, reason: 'Try a small k' });
    expect(lowK.status).toBe(422);
    expect(lowK.body.error.issues[0].path).toEqual(['rules', 'exportK']);
    const { exportK: _k, ...missing } = rules;
    const partial = await steward.put('/api/admin/rules').send({ rules: missing, reason: 'Forgot one' });
    expect(partial.status).toBe(422);
    expect(partial.body.error.issues[0]).toMatchObject({ path: ['rules', 'exportK'], message: 'Give the setting exportK' });
    const unknown = await steward.put('/api/admin/rules').send({ rules: { ...rules, recovery: { instrumentCode: 'no-such', threshold: 2 } }, reason: 'Typo' });
    expect(unknown.status).toBe(422);
    const outside = await steward.put('/api/admin/rules').send({ rules: withThreshold(rules, 11), reason: 'Out of range' });
    expect(outside.status).toBe(422);
    expect(outside.body.error.message).toMatch(/0–10/);
    const badWindow = await steward.put('/api/admin/rules').send({ rules: { ...rules, primaryWindow: { fromWeek: 10, toWeek: 16, targetWeek: 20 } }, reason: 'Odd window' });
    expect(badWindow.status).toBe(422);
    const same = await steward.put('/api/admin/rules').send({ rules, reason: 'No change at all' });
    expect(same.status).toBe(422);
    expect(await count()).toBe(before);
    expect(await auditCountBy(ctx.db, stewardId, 'registry-rules')).toBe(auditBefore);
  });

  it('a change stores a new version with who and why, keeps the old one, is audited once, and bumps the data version', async () => {
    const old = await currentRules(ctx.db);
    const auditBefore = await auditCountBy(ctx.db, stewardId, 'registry-rules');
    const dataBefore = await readDataVersion(ctx.db);
    const res = await steward.put('/api/admin/rules').send({
      rules: withThreshold(old.rules, 1),
      reason: 'Stricter recovery: first-step pain at most 1/10',
      baseVersion: old.version,
    });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({
      reason: 'Stricter recovery: first-step pain at most 1/10',
      changedById: stewardId,
      changedByName: 'Test steward',
      changes: [{ path: 'recovery.threshold', from: 2, to: 1 }],
    });
    expect(res.body.version).toBeGreaterThan(old.version);
    expect(await auditCountBy(ctx.db, stewardId, 'registry-rules')).toBe(auditBefore + 1);
    // The analytics cache is keyed by the data version; a rules change moves it on (trigger on registry_rules).
    expect(await readDataVersion(ctx.db)).toBeGreaterThan(dataBefore);

    const admin = await steward.get('/api/admin/rules');
    expect(admin.body.current.version).toBe(res.body.version);
    expect(admin.body.history.map((h: { version: number }) => h.version)).toContain(old.version);
    expect(admin.body.history.at(-1)).toMatchObject({ version: 0, reason: 'Shipped defaults', changes: [] });
    const oldAgain = await rulesAt(ctx.db, old.version);
    expect(oldAgain!.rules).toEqual(old.rules);

    const pub = await steward.get('/api/rules/current');
    expect(pub.body).toMatchObject({ version: res.body.version, changedByName: 'Test steward', rules: { recovery: { threshold: 1 } } });

    // A form based on the old version is refused instead of silently overwriting.
    const stale = await steward.put('/api/admin/rules').send({ rules: withThreshold(old.rules, 3), reason: 'From a stale form', baseVersion: old.version });
    expect(stale.status).toBe(409);
  });

  it('old numbers are recomputed under the old version: the 12-week share recovered differs and each matches a direct computation', async () => {
    const history = (await steward.get('/api/admin/rules')).body.history as { version: number; rules: RegistryRules }[];
    const strict = history.find((h) => h.rules.recovery.threshold === 1)!;
    const lenient = history.find((h) => h.version < strict.version && h.rules.recovery.threshold === 2)!;
    const vNew = (await rulesAt(ctx.db, strict.version))!;
    const vOld = (await rulesAt(ctx.db, lenient.version))!;
    // Product-limit by hand. Threshold 2: events at 6, 6, 12; censored at 4 and 12 → S(12) = (2/4)(1/2) = 1/4.
    // Threshold 1: events at 6 and 12; censored at 4, 12, 12 → S(12) = (3/4)(2/3) = 1/2.
    const direct = { old: 1 - (2 / 4) * (1 / 2), new: 1 - (3 / 4) * (2 / 3) };
    expect(await shareAt12FromRows(vOld)).toBeCloseTo(direct.old, 12);
    expect(await shareAt12FromRows(vNew)).toBeCloseTo(direct.new, 12);
    expect(await shareAt12ViaAnalytics(vOld)).toBeCloseTo(direct.old, 12);
    expect(await shareAt12ViaAnalytics(vNew)).toBeCloseTo(direct.new, 12);
    expect(direct.old).not.toBeCloseTo(direct.new, 6);
  });

  it('a dashboard answer names the rules version, and a rules change is not served from the cache', async () => {
    const url = `/api/analytics/recovery?clinic=${clinicId}`;
    const first = await steward.get(url);
    expect(first.status).toBe(200);
    expect((await steward.get(url)).headers['x-analytics-cache']).toBe('hit');
    const now = await currentRules(ctx.db);
    expect(first.body.meta.rulesVersion).toBe(now.version);
    const put = await steward.put('/api/admin/rules').send({ rules: { ...now.rules, minCellEstimate: now.rules.minCellEstimate + 2 }, reason: 'Larger groups before an estimate' });
    expect(put.status).toBe(200);
    const after = await steward.get(url);
    expect(after.headers['x-analytics-cache']).toBe('miss');
    expect(after.body.meta.rulesVersion).toBe(put.body.version);
  });
});
