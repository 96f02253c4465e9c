import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eq, inArray } from 'drizzle-orm';
import {
  addOnAssociations,
  bmi,
  bmiBand,
  classifyResponder,
  clinicComparison,
  compareRecoveryBySubgroup,
  recoveredByWeek,
  stratumKey,
  symptomDurationBand,
  type Obs,
} from '../../analysis/index';
import {
  OutcomesResponseSchema,
  AddOnsResponseSchema,
  ClinicsResponseSchema,
  RecoveryResponseSchema,
  TrajectoryResponseSchema,
} from '../../shared/schemas/analytics';
import { severityBand } from '../../analysis/index';
import { assessments, clinics, episodes, instruments, scores } from '../../server/db/schema';
import { testApp } from '../setup/test-app';
import { signedInClient } from '../setup/auth';
import { seedAnalyticsFixture, type AnalyticsFixture } from './analytics-fixtures';
import {
  baselineOf,
  closeTo,
  loadRegistry,
  recoveryOf,
  responderOf,
  series,
  type Registry,
} from './analytics-recompute';

const ctx = testApp();
let fx: AnalyticsFixture;
let reg: Registry;
afterAll(() => ctx.close());
beforeAll(async () => {
  fx = await seedAnalyticsFixture(ctx.db, { clinics: 4, perClinic: 45, seed: 11 });
  reg = await loadRegistry(ctx.db);
});

const get = async (email: string, url: string, status = 200) => {
  const res = await (await signedInClient(ctx.app, email)).get(url);
  expect(res.status, `${JSON.stringify(res.body)} ${ctx.logs.join('\n')}`).toBe(status);
  return res.body;
};

describe('GET /api/analytics/recovery', () => {
  it('matches Kaplan-Meier and log-rank recomputed per BMI band for the lead’s clinic', async () => {
    const body = RecoveryResponseSchema.parse(await get(fx.users.lead, '/api/analytics/recovery?groupBy=bmi'));
    const own = reg.episodes.filter((e) => e.clinicId === fx.clinicIds[0]);
    const items = own
      .map((e) => ({ obs: recoveryOf(reg, e), level: bmiBand(bmi(e.heightCm, e.weightKg)) }))
      .filter((i): i is { obs: Obs; level: ReturnType<typeof bmiBand> } => i.obs !== null);
    const expected = compareRecoveryBySubgroup(items, 'bmi', {
      weeks: [6, 12, 26],
      minGroupSize: reg.rules.minCellEstimate,
    });
    expect(body.groups.map((g) => [g.level, g.n, g.tooFew])).toEqual(
      expected.levels.map((l) => [l.level, l.n, l.tooFew]),
    );
    for (const g of body.groups) {
      const l = expected.levels.find((x) => x.level === g.level)!;
      if (l.tooFew) {
        expect(g.curve).toBeNull();
        continue;
      }
      expect([g.recovered, g.censored]).toEqual([l.summary!.recovered, l.summary!.censored]);
      expect(closeTo(g.median, l.summary!.medianWeeks)).toEqual([]);
      expect(closeTo(g.atWeeks, l.summary!.atWeeks)).toEqual([]);
    }
    expect(closeTo(body.logRank?.pValue ?? null, expected.logRank?.pValue ?? null)).toEqual([]);
    expect([body.rulesVersion, body.meta.rulesVersion]).toEqual([reg.rulesVersion, reg.rulesVersion]);
  });

  it('gives researchers consenting episodes of the whole registry only, and never a single clinic', async () => {
    const body = RecoveryResponseSchema.parse(
      await get(fx.users.researcher, '/api/analytics/recovery?groupBy=activity'),
    );
    expect(body.meta.consentingOnly).toBe(true);
    expect(body.meta.options.clinics).toEqual([]);
    const consenting = reg.episodes.filter((e) => e.consent);
    expect(body.nEpisodes).toBe(consenting.length);
    const runners = consenting.filter((e) => e.activity === 'runner' && recoveryOf(reg, e) !== null).length;
    expect(body.groups.find((g) => g.level === 'runner')?.n).toBe(runners);
    expect(JSON.stringify(body)).not.toContain('Analytics test clinic');
    await get(fx.users.researcher, `/api/analytics/recovery?clinic=${fx.clinicIds[0]}`, 403);
  });

  it('groups by baseline severity of the chosen instrument, and narrows another screen to one severity', async () => {
    const body = RecoveryResponseSchema.parse(
      await get(fx.users.lead, '/api/analytics/recovery?groupBy=severity&instrument=faam-adl'),
    );
    const inst = reg.instruments.find((i) => i.code === 'faam-adl')!;
    const own = reg.episodes.filter((e) => e.clinicId === fx.clinicIds[0] && recoveryOf(reg, e) !== null);
    const level = (e: (typeof own)[number]) => {
      const b = baselineOf(e, inst.id);
      return b === null ? null : severityBand(b, inst);
    };
    for (const g of body.groups) expect(g.n, g.level).toBe(own.filter((e) => level(e) === g.level).length);
    expect(body.nMissingLevel).toBe(own.filter((e) => level(e) === null).length);
    const mild = OutcomesResponseSchema.parse(
      await get(fx.users.lead, '/api/analytics/outcomes?instrument=faam-adl&subgroup=severity&level=mild'),
    );
    const all = reg.episodes.filter((e) => e.clinicId === fx.clinicIds[0]);
    expect(mild.tiles.episodes).toBe(all.filter((e) => level(e) === 'mild').length);
  });

  it('marks subgroups under the minimum as too few to estimate', async () => {
    const body = RecoveryResponseSchema.parse(await get(fx.users.lead, '/api/analytics/recovery?groupBy=age'));
    const small = body.groups.filter((g) => (g.n ?? 0) < reg.rules.minCellEstimate);
    expect(small.length).toBeGreaterThan(0);
    for (const g of small) expect([g.tooFew, g.curve, g.median]).toEqual([true, null, null]);
  });
});

describe('GET /api/analytics/addons', () => {
  it('matches crude and Mantel-Haenszel risk ratios and BH-adjusted p-values recomputed from the rows', async () => {
    const body = AddOnsResponseSchema.parse(await get(fx.users.lead, '/api/analytics/addons?clinic=registry'));
    const inst = reg.instruments.find((i) => i.code === 'nprs-first-step')!;
    const eps = reg.episodes.map((e) => {
      const s = responderOf(reg, e, inst);
      return {
        responder: s === 'responder' ? true : s === 'non-responder' ? false : null,
        addOns: e.addOns,
        stratum: stratumKey(e.activity, symptomDurationBand(e.symptomWeeks)),
      };
    });
    const expected = addOnAssociations(eps, {
      addOns: body.rows.map((r) => r.code),
      minArm: reg.rules.minCellEstimate,
    });
    expect(body.nMissingOutcome).toBe(expected.nMissingOutcome);
    for (const row of body.rows) {
      const c = expected.comparisons.find((x) => x.addOn === row.code)!;
      expect([row.withAddOn, row.withoutAddOn]).toEqual([
        { n: c.withAddOn.n, responders: c.withAddOn.responders },
        { n: c.withoutAddOn.n, responders: c.withoutAddOn.responders },
      ]);
      expect(closeTo(row.crude, c.riskRatio)).toEqual([]);
      expect(closeTo(row.adjusted, c.mhRiskRatio)).toEqual([]);
      expect(closeTo(row.riskDifference, c.riskDifference)).toEqual([]);
      expect(closeTo([row.pValue, row.pAdjusted], [c.pValue, c.pAdjusted])).toEqual([]);
    }
    expect(body.rows.find((r) => r.code === 'taping')?.adjusted).not.toBeNull();
  });

  it('refuses an instrument without an MCID (422) and the steward (403)', async () => {
    await get(fx.users.lead, '/api/analytics/addons?instrument=groc', 422);
    await get(fx.users.steward, '/api/analytics/addons', 403);
  });
});

describe('GET /api/analytics/clinics (peer comparison)', () => {
  it('matches the funnel recomputation and shows a lead only their own code', async () => {
    const body = ClinicsResponseSchema.parse(await get(fx.users.lead, '/api/analytics/clinics'));
    const inst = reg.instruments.find((i) => i.code === 'nprs-first-step')!;
    const active = reg.episodes.filter((e) => e.clinicActive);
    const counts = new Map<number, number>();
    for (const e of active) counts.set(e.clinicId, (counts.get(e.clinicId) ?? 0) + 1);
    const shown = active.filter((e) => (counts.get(e.clinicId) ?? 0) >= reg.rules.minCellEstimate);
    const expected = clinicComparison(
      shown.map((e) => {
        const s = responderOf(reg, e, inst);
        const obs = recoveryOf(reg, e);
        return {
          clinic: String(e.clinicId),
          responder: s === 'responder' ? true : s === 'non-responder' ? false : null,
          recoveredBy12: obs && recoveredByWeek(obs, 12),
        };
      }),
    );
    expect(body.centre).toEqual({ responder: expected.targets.responder, recovered: expected.targets.recoveredBy12 });
    const mine = body.clinics.filter((c) => c.highlighted);
    expect(mine.map((c) => c.label)).toEqual([`Your clinic (${fx.codes[0]})`]);
    const mineExpected = expected.clinics.find((c) => c.clinic === String(fx.clinicIds[0]))!;
    expect(mine[0]!.recovered).toMatchObject({
      n: mineExpected.recoveredBy12.n,
      count: mineExpected.recoveredBy12.count,
      flag95: mineExpected.recoveredBy12.flag95,
    });
    expect(body.clinics.length).toBe(expected.clinics.length);
    expect(body.clinics.every((c) => c.name === null)).toBe(true);
    expect(JSON.stringify(body)).not.toMatch(new RegExp(fx.codes.slice(1).join('|')));
    expect(body.limits.recovered.length).toBeGreaterThan(40);
  });

  it('gives researchers fresh anonymous labels on each request and no highlight', async () => {
    const client = await signedInClient(ctx.app, fx.users.researcher);
    const maps = new Set<string>();
    for (let i = 0; i < 6; i++) {
      const body = ClinicsResponseSchema.parse((await client.get('/api/analytics/clinics')).body);
      expect(body.clinics.some((c) => c.highlighted)).toBe(false);
      expect(body.clinics.every((c) => /^Peer \d+$/.test(c.label))).toBe(true);
      maps.add(
        body.clinics
          .map((c) => `${c.label}:${c.nEpisodes}:${c.recovered.count}`)
          .sort()
          .join('|'),
      );
    }
    expect(maps.size).toBeGreaterThan(1);
  });

  it('drops a deactivated clinic at once (the write invalidates the cache)', async () => {
    const before = ClinicsResponseSchema.parse(await get(fx.users.steward, '/api/analytics/clinics'));
    expect(before.clinics.map((c) => c.label)).toContain(fx.codes[3]);
    await ctx.db.update(clinics).set({ active: false }).where(eq(clinics.id, fx.clinicIds[3]!));
    const after = ClinicsResponseSchema.parse(await get(fx.users.steward, '/api/analytics/clinics'));
    expect(after.clinics.map((c) => c.label)).not.toContain(fx.codes[3]);
    expect(after.meta.dataVersion).toBeGreaterThan(before.meta.dataVersion);
    expect(after.clinics.find((c) => c.label === fx.codes[0])?.name).toMatch(/Analytics test clinic/);
    await get(fx.users.clinician, '/api/analytics/clinics', 403);
  });
});

describe('GET /api/analytics/episodes/:id/trajectory', () => {
  it('returns the stored scores with the MCID level, steps, and flags a rise of 2 in first-step pain', async () => {
    const [ep] = await ctx.db.select().from(episodes).where(inArray(episodes.id, fx.episodeIds)).limit(1);
    const pain = (await ctx.db.select().from(instruments).where(eq(instruments.code, 'nprs-first-step')))[0]!;
    // Replace this episode's first-step pain with a known course: 7 → 3 → 5 (a rise of 2) → 4.
    const rows = await ctx.db
      .select()
      .from(assessments)
      .where(eq(assessments.episodeId, ep!.id))
      .orderBy(assessments.assessedOn);
    const course = [7, 3, 5, 4];
    for (const [i, a] of rows.entries()) {
      await ctx.db.delete(scores).where(eq(scores.assessmentId, a.id));
      if (i < course.length)
        await ctx.db.insert(scores).values({ assessmentId: a.id, instrumentId: pain.id, value: course[i]! });
    }
    const body = TrajectoryResponseSchema.parse(
      await get(fx.users.clinician, `/api/analytics/episodes/${ep!.id}/trajectory`),
    );
    const p = body.instruments.find((i) => i.instrument.code === 'nprs-first-step')!;
    expect(p.points.map((x) => x.value)).toEqual(course.slice(0, rows.length));
    expect([p.baseline, p.mcidLevel]).toEqual([7, 5]);
    const fresh = await loadRegistry(ctx.db);
    const e = fresh.episodes.find((x) => x.id === ep!.id)!;
    expect(p.points.map((x) => x.weeks)).toEqual(series(e, pain.id).map((a) => a.weeks));
    expect(baselineOf(e, pain.id)).toBe(7);
    if (rows.length >= 3) expect(body.flags.map((f) => [f.previous, f.value])).toContainEqual([3, 5]);
    expect(body.steps.length).toBe(rows.filter((r) => r.avgDailySteps !== null).length);
    const status = classifyResponder(
      { baseline: 7, assessments: series(e, pain.id) },
      { higherIsBetter: false, threshold: 2 },
    ).status;
    expect(['responder', 'non-responder', 'missing-follow-up']).toContain(status);
  });

  it('hides other clinics’ episodes (404) and refuses researchers (403)', async () => {
    const other = reg.episodes.find((e) => e.clinicId === fx.clinicIds[1])!;
    await get(fx.users.lead, `/api/analytics/episodes/${other.id}/trajectory`, 404);
    await get(fx.users.lead, '/api/analytics/episodes/not-a-number/trajectory', 422);
    await get(fx.users.researcher, `/api/analytics/episodes/${other.id}/trajectory`, 403);
    await get(fx.users.steward, `/api/analytics/episodes/${other.id}/trajectory`, 200);
  });
});
