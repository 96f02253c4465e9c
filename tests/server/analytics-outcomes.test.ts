import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  changeScore,
  compareWithTarget,
  isResponder,
  kaplanMeier,
  recoveredShareAt,
  responderShare,
  summariseChange,
  selectPrimaryFollowUp,
  summariseRecoveryCurve,
  wilsonInterval,
  type Obs,
} from '../../analysis/index';
import { OutcomesResponseSchema } from '../../shared/schemas/analytics';
import { testApp } from '../setup/test-app';
import { signedInClient } from '../setup/auth';
import { seedAnalyticsFixture, type AnalyticsFixture } from './analytics-fixtures';
import {
  baselineOf,
  loadRegistry,
  recoveryOf,
  responderOf,
  series,
  week12Completeness,
  type Registry,
} from './analytics-recompute';

// Every number on the Clinic results screen, recomputed from plain selects with the analysis/ functions.
const ctx = testApp();
let fx: AnalyticsFixture;
let reg: Registry;
afterAll(() => ctx.close());
beforeAll(async () => {
  fx = await seedAnalyticsFixture(ctx.db, { clinics: 3, perClinic: 70, seed: 7 });
  reg = await loadRegistry(ctx.db);
});

const close = (a: number | null | undefined, b: number | null | undefined) => {
  if (b === null || b === undefined) expect(a ?? null).toBeNull();
  else expect(a).toBeCloseTo(b, 9);
};

async function outcomes(email: string, query = '') {
  const client = await signedInClient(ctx.app, email);
  const res = await client.get(`/api/analytics/outcomes${query}`);
  expect(res.status, `${JSON.stringify(res.body)} ${ctx.logs.join('\n')}`).toBe(200);
  return OutcomesResponseSchema.parse(res.body);
}

describe('GET /api/analytics/outcomes (clinic results)', () => {
  it('matches a recomputation of every tile, curve, change distribution and trend for the lead’s clinic', async () => {
    const body = await outcomes(fx.users.lead);
    const clinicId = fx.clinicIds[0]!;
    const own = reg.episodes.filter((e) => e.clinicId === clinicId);
    const inst = reg.instruments.find((i) => i.code === 'nprs-first-step')!;
    expect([body.rulesVersion, body.meta.rulesVersion]).toEqual([reg.rulesVersion, reg.rulesVersion]);
    expect(body.meta.subject).toMatchObject({ kind: 'clinic', clinicId });
    expect(body.tiles.episodes).toBe(own.length);
    expect(own.length).toBe(70);

    // Follow-up completeness at week 12 (Wilson interval of completed / due).
    const comp = own.map((e) => week12Completeness(reg, e));
    const due = comp.filter((c) => c.due);
    const done = due.filter((c) => c.done).length;
    expect(body.tiles.completeness.due).toBe(due.length);
    expect(body.tiles.completeness.completed).toBe(done);
    const w = wilsonInterval(done, due.length);
    close(body.tiles.completeness.share?.estimate, w.estimate);
    close(body.tiles.completeness.share?.lower, w.lower);
    close(body.tiles.completeness.share?.upper, w.upper);

    // Responders at the primary follow-up (change >= MCID), missing follow-ups reported as missing.
    const statuses = own.map((e) => responderOf(reg, e, inst));
    const t = body.tiles.responders!;
    expect(t.nAnalysed).toBe(statuses.filter((s) => s === 'responder' || s === 'non-responder').length);
    expect(t.responders).toBe(statuses.filter((s) => s === 'responder').length);
    expect(t.nMissingFollowUp).toBe(statuses.filter((s) => s === 'missing-follow-up').length);
    expect(t.nMissingFollowUp).toBeGreaterThan(0);
    const rw = wilsonInterval(t.responders, t.nAnalysed);
    close(t.share?.lower, rw.lower);
    close(t.share?.upper, rw.upper);
    expect(t.position).toBe(compareWithTarget(rw, reg.rules.targets.respondersAtWeek12));

    // Share recovered by week 12 (Kaplan-Meier) against the registry's expectation, and the median.
    const obs = own.map((e) => recoveryOf(reg, e)).filter((o): o is Obs => o !== null);
    const km = summariseRecoveryCurve(obs, { weeks: [12] });
    const at = km.atWeeks[0]!;
    close(body.tiles.recovered.share?.estimate, at.estimate);
    close(body.tiles.recovered.share?.lower, at.lower);
    close(body.tiles.recovered.share?.upper, at.upper);
    expect(body.tiles.recovered.target).toBe(reg.rules.targets.recoveredByWeek12);
    expect(body.tiles.recovered.position).toBe(compareWithTarget(at, reg.rules.targets.recoveredByWeek12));
    close(body.tiles.medianWeeks?.estimate, km.medianWeeks.estimate);
    close(body.tiles.medianWeeks?.lower, km.medianWeeks.lower);
    close(body.tiles.medianWeeks?.upper, km.medianWeeks.upper);

    // The clinic's curve at every event time, and the registry's curve over every episode with an assessment.
    const curve = body.curves.find((c) => c.series === 'subject')!;
    const fit = kaplanMeier(obs);
    const eventTimes = fit.steps.filter((s) => s.nEvent > 0).map((s) => s.time);
    for (const time of eventTimes) {
      const p = curve.points.find((x) => x.weeks === time)!;
      const r = recoveredShareAt(fit, time);
      close(p.share, r.estimate);
      close(p.lower, r.lower);
      close(p.upper, r.upper);
    }
    // The table behind the chart reads the curve every two weeks up to the last follow-up.
    const lastTime = fit.steps.at(-1)!.time;
    const expectedReadings = [];
    for (let w = 2; w <= lastTime; w += 2) {
      const r = recoveredShareAt(fit, w);
      if (r.estimate !== null) expectedReadings.push({ weeks: w, share: r.estimate, lower: r.lower, upper: r.upper });
    }
    expect(curve.readings).toEqual(expectedReadings);
    const registryObs = reg.episodes.map((e) => recoveryOf(reg, e)).filter((o): o is Obs => o !== null);
    const regCurve = body.curves.find((c) => c.series === 'registry')!;
    expect(regCurve.n).toBe(registryObs.length);
    const regFit = kaplanMeier(registryObs);
    const lastEvent = [...regFit.steps].reverse().find((s) => s.nEvent > 0)!;
    close(regCurve.points.find((p) => p.weeks === lastEvent.time)?.share, 1 - lastEvent.survival);

    // Change scores per instrument at the primary follow-up, with the MCID count.
    for (const ch of body.changes) {
      const i = reg.instruments.find((x) => x.code === ch.instrument.code)!;
      const pairs = own.flatMap((e) => {
        const b = baselineOf(e, i.id);
        const pw = reg.rules.primaryWindow;
        const best = selectPrimaryFollowUp(series(e, i.id), {
          target: pw.targetWeek,
          from: pw.fromWeek,
          to: pw.toWeek,
        });
        if (b === null || best === null) return [];
        return [{ baseline: b, followUp: best.value }];
      });
      const s = summariseChange(pairs, { higherIsBetter: i.higherIsBetter });
      expect(ch.n).toBe(pairs.length);
      close(ch.meanChange, s.meanChange);
      close(ch.meanLower, s.meanChangeCi?.lower);
      close(ch.median, s.median);
      close(ch.q1, s.q1);
      close(ch.q3, s.q3);
      const values = pairs.map((p) => changeScore(p.baseline, p.followUp, i.higherIsBetter));
      expect([...ch.values].sort((a, b) => a - b)).toEqual([...values].sort((a, b) => a - b));
      expect(ch.atLeastMcid).toBe(values.filter((v) => isResponder(v, i.mcid!)).length);
    }
    expect(body.changes.map((c) => c.instrument.code)).toEqual(
      expect.arrayContaining(['nprs-first-step', 'faam-adl', 'lefs']),
    );

    // Responder share by quarter of the episode's start.
    const quarters = [...new Set(own.map((e) => e.quarter))].sort();
    expect(body.trend.map((q) => q.quarter)).toEqual(quarters);
    for (const q of body.trend) {
      const r = responderShare(
        own
          .filter((e) => e.quarter === q.quarter)
          .map((e) => ({ baseline: baselineOf(e, inst.id), assessments: series(e, inst.id) })),
        { higherIsBetter: false, threshold: inst.mcid!, window: { target: 12, from: 10, to: 16 } },
      );
      expect([q.nAnalysed, q.responders]).toEqual([r.nAnalysed, r.responders]);
      expect(q.tooFew).toBe(r.nAnalysed < reg.rules.minCellEstimate);
      if (!q.tooFew) close(q.share?.estimate, r.share?.estimate);
    }
  });

  it('narrows to a period and to one subgroup, and counts only what falls inside', async () => {
    const body = await outcomes(fx.users.clinician, '?from=2024-04-01&to=2024-12-31&subgroup=activity&level=runner');
    const own = reg.episodes.filter(
      (e) =>
        e.clinicId === fx.clinicIds[0] &&
        e.startDate >= '2024-04-01' &&
        e.startDate <= '2024-12-31' &&
        e.activity === 'runner',
    );
    expect(body.tiles.episodes).toBe(own.length);
    expect(body.tiles.recovered.n).toBe(own.map((e) => recoveryOf(reg, e)).filter(Boolean).length);
  });

  it('lets the steward pick any clinic and refuses a lead another clinic’s results', async () => {
    const body = await outcomes(fx.users.steward, `?clinic=${fx.clinicIds[1]}`);
    expect(body.tiles.episodes).toBe(reg.episodes.filter((e) => e.clinicId === fx.clinicIds[1]).length);
    expect(body.meta.options.clinics.length).toBeGreaterThanOrEqual(3);
    const lead = await signedInClient(ctx.app, fx.users.lead);
    const res = await lead.get(`/api/analytics/outcomes?clinic=${fx.clinicIds[1]}`);
    expect(res.status).toBe(403);
    const researcher = await signedInClient(ctx.app, fx.users.researcher);
    expect((await researcher.get('/api/analytics/outcomes')).status).toBe(403);
  });

  it('answers 422 for bad filters and 401 when signed out', async () => {
    const lead = await signedInClient(ctx.app, fx.users.lead);
    expect((await lead.get('/api/analytics/outcomes?from=2025-02-30')).status).toBe(422);
    expect((await lead.get('/api/analytics/outcomes?from=2025-03-01&to=2025-01-01')).status).toBe(422);
    expect((await lead.get('/api/analytics/outcomes?instrument=no-such')).status).toBe(422);
    expect((await lead.get('/api/analytics/outcomes?subgroup=bmi')).status).toBe(422);
    expect((await lead.get('/api/analytics/outcomes?colour=red')).status).toBe(422);
    const res = await lead.agent.get('/api/analytics/outcomes?groupBy=shoe');
    expect(res.status).toBe(422);
    expect(res.body.error.issues[0].path).toEqual(['groupBy']);
    const { anonymousClient } = await import('../setup/auth');
    expect((await (await anonymousClient(ctx.app)).get('/api/analytics/outcomes')).status).toBe(401);
  });
});
