import { describe, it, expect } from 'vitest';
import {
  recoveryObservation,
  recoveredShareAt,
  timeToRecovery,
  compareRecoveryBySubgroup,
  kaplanMeier,
  logRank,
  DEFAULT_RECOVERY_RULE,
} from '../../analysis/index';
import type { Assessment, Obs, RecoveryEpisode } from '../../analysis/index';
import freireich from '../fixtures/stats/kaplan-meier-freireich.json';
import lrRef from '../fixtures/stats/logrank-freireich.json';
import { expectClose } from './helpers/close';
import { sixMp, placebo } from './helpers/freireich';

/** Weekly NPRS series that first reaches <= 2 at an event's week, or stops at a censoring week. */
function seriesFor(o: Obs): Assessment[] {
  const out: Assessment[] = [{ weeks: 0, value: 7 }];
  for (let w = 1; w <= o.time; w++) out.push({ weeks: w, value: o.event && w === o.time ? 1 : 5 });
  return out;
}

describe('recoveryObservation: event at the first assessment meeting the rule, else censored at the last', () => {
  it('default rule is NPRS <= 2 (common practice, no published source)', () => {
    expect(DEFAULT_RECOVERY_RULE).toEqual({ threshold: 2, direction: 'atMost' });
  });
  it('event at the first qualifying week, even if later values rise again; order does not matter', () => {
    const series = Object.freeze([
      { weeks: 12, value: 4 },
      { weeks: 0, value: 8 },
      { weeks: 8, value: 2 },
      { weeks: 4, value: 5 },
    ]);
    expect(recoveryObservation(series)).toEqual({ time: 8, event: true });
  });
  it('censored at the last assessment when never recovered', () => {
    expect(
      recoveryObservation([
        { weeks: 0, value: 8 },
        { weeks: 6, value: 4 },
        { weeks: 14, value: 3 },
      ]),
    ).toEqual({
      time: 14,
      event: false,
    });
  });
  it('the week-0 baseline never counts as recovery; baseline only -> censored at 0', () => {
    expect(recoveryObservation([{ weeks: 0, value: 1 }])).toEqual({ time: 0, event: false });
    expect(
      recoveryObservation([
        { weeks: 0, value: 1 },
        { weeks: 6, value: 2 },
      ]),
    ).toEqual({ time: 6, event: true });
  });
  it('direction-aware: atLeast for higher-is-better scales', () => {
    const rule = { threshold: 70, direction: 'atLeast' as const };
    expect(
      recoveryObservation(
        [
          { weeks: 0, value: 40 },
          { weeks: 6, value: 65 },
          { weeks: 10, value: 72 },
        ],
        rule,
      ),
    ).toEqual({
      time: 10,
      event: true,
    });
  });
  it('empty series gives null; invalid input throws RangeError', () => {
    expect(recoveryObservation([])).toBeNull();
    expect(() => recoveryObservation([{ weeks: -2, value: 1 }])).toThrow(RangeError);
    expect(() => recoveryObservation([{ weeks: 2, value: 1 }], { threshold: NaN, direction: 'atMost' })).toThrow(
      RangeError,
    );
    expect(() =>
      recoveryObservation([{ weeks: 2, value: 1 }], { threshold: 2, direction: 'below' as unknown as 'atMost' }),
    ).toThrow(RangeError);
  });
});

describe('recoveredShareAt: 1 - KM with flipped bounds (Freireich 6-MP arm read as recovery times)', () => {
  const rows = freireich.results['6-MP'].event_rows;
  const km = kaplanMeier(sixMp);
  it('week 12 reads the week-10 row: share 0.247059, bounds 1 - upper / 1 - lower (log-log)', () => {
    const r10 = rows.find((r) => r.time === 10);
    const s = recoveredShareAt(km, 12);
    expectClose(s.estimate, 1 - (r10?.survival ?? NaN));
    expectClose(s.lower, 1 - (r10?.ci_loglog[1] ?? NaN));
    expectClose(s.upper, 1 - (r10?.ci_loglog[0] ?? NaN));
    expect((s.lower ?? 1) <= (s.estimate ?? 0) && (s.estimate ?? 1) <= (s.upper ?? 0)).toBe(true);
  });
  it('at an event time the step at that time applies (right-continuous)', () => {
    expectClose(recoveredShareAt(km, 6).estimate, 1 - 18 / 21);
  });
  it('before the first time: 0 with null bounds; beyond the last follow-up while still at risk: null', () => {
    expect(recoveredShareAt(km, 2)).toEqual({ weeks: 2, estimate: 0, lower: null, upper: null });
    expect(recoveredShareAt(km, 40)).toEqual({ weeks: 40, estimate: null, lower: null, upper: null });
  });
  it('after S reached 0 everyone has recovered: share 1 beyond the last time', () => {
    expect(recoveredShareAt(kaplanMeier(placebo), 40).estimate).toBe(1);
  });
  it('throws RangeError for negative or non-finite weeks', () => {
    expect(() => recoveredShareAt(km, -1)).toThrow(RangeError);
    expect(() => recoveredShareAt(km, NaN)).toThrow(RangeError);
  });
});

describe('timeToRecovery: overall and by subgroup', () => {
  const episodes: RecoveryEpisode[] = [
    ...sixMp.map((o, i) => ({ series: seriesFor(o), subgroups: { arm: '6-MP', site: i % 2 ? 'north' : 'south' } })),
    ...placebo.map((o) => ({ series: seriesFor(o), subgroups: { arm: 'placebo', site: 'north' } })),
    // too small a level: excluded from estimates and from the log-rank test
    ...[3, 5, 9].map((t) => ({ series: seriesFor({ time: t, event: true }), subgroups: { arm: 'pilot', site: null } })),
    { series: [], subgroups: { arm: 'placebo' } },
  ];
  const frozen = Object.freeze(episodes.map((e) => Object.freeze(e)));
  const report = timeToRecovery(frozen, { subgroupKeys: ['arm', 'site'] });

  it('counts episodes and those without any assessment', () => {
    expect(report.nEpisodes).toBe(46);
    expect(report.nWithoutAssessments).toBe(1);
    expect(report.overall).toMatchObject({ level: 'all', n: 45, tooFew: false });
    expect(report.rule).toEqual(DEFAULT_RECOVERY_RULE);
  });
  it('per-arm shares at 6, 12, 26 weeks and medians match Kaplan-Meier on the Freireich arms', () => {
    const arm = report.subgroups.find((s) => s.key === 'arm');
    const mp = arm?.levels.find((l) => l.level === '6-MP');
    expect(mp?.summary?.atWeeks.map((w) => w.weeks)).toEqual([6, 12, 26]);
    expectClose(mp?.summary?.atWeeks[1]?.estimate, 1 - 0.7529411765);
    expect(mp?.summary?.medianWeeks).toEqual(kaplanMeier(sixMp).median);
    expect(mp?.summary).toMatchObject({ n: 21, recovered: 9, censored: 12 });
    const pl = arm?.levels.find((l) => l.level === 'placebo');
    expect(pl?.summary?.medianWeeks.estimate).toBe(8);
    expect(pl?.summary?.atWeeks[2]?.estimate).toBe(1); // everyone recovered by week 23
  });
  it('levels below the minimum (default 10) are marked too few, without estimates, and left out of the log-rank', () => {
    const arm = report.subgroups.find((s) => s.key === 'arm');
    expect(arm?.levels.find((l) => l.level === 'pilot')).toEqual({ level: 'pilot', n: 3, tooFew: true, summary: null });
    // log-rank over 6-MP vs placebo only: the Freireich value 16.792941
    expectClose(arm?.logRank?.chiSquare, lrRef.results.chisq);
    expect(arm?.logRank?.groups.map((g) => g.group)).toEqual(['6-MP', 'placebo']);
    expect(arm?.logRankNote).toBeNull();
  });
  it('episodes without a level are counted, not dropped silently', () => {
    const site = report.subgroups.find((s) => s.key === 'site');
    expect(site?.nMissingLevel).toBe(3);
    expect(site?.levels.map((l) => [l.level, l.n])).toEqual([
      ['north', 31],
      ['south', 11],
    ]);
    const direct = logRank(
      episodes
        .filter((e) => e.series.length > 0 && e.subgroups?.site)
        .map((e) => ({ ...(recoveryObservationOf(e) as Obs), group: e.subgroups?.site ?? '' })),
    );
    expectClose(site?.logRank?.chiSquare, direct.chiSquare, 1e-12);
  });
  it('a larger minimum suppresses more levels; fewer than two eligible levels gives a null log-rank with a note', () => {
    const r = timeToRecovery(episodes, { subgroupKeys: ['site'], minGroupSize: 15 });
    const site = r.subgroups[0];
    expect(site?.levels.find((l) => l.level === 'south')?.tooFew).toBe(true);
    expect(site?.logRank).toBeNull();
    expect(site?.logRankNote).toMatch(/fewer than two levels/);
  });
  it('overall group below the minimum is marked too few', () => {
    const r = timeToRecovery(episodes.slice(0, 5));
    expect(r.overall).toMatchObject({ n: 5, tooFew: true, summary: null });
  });
  it('subgroup keys default to every key found, sorted', () => {
    expect(timeToRecovery(episodes).subgroups.map((s) => s.key)).toEqual(['arm', 'site']);
  });
  it('throws RangeError for an invalid minimum group size, week or confidence level', () => {
    expect(() => timeToRecovery(episodes, { minGroupSize: 0 })).toThrow(RangeError);
    expect(() => timeToRecovery(episodes, { minGroupSize: 2.5 })).toThrow(RangeError);
    expect(() => timeToRecovery(episodes, { weeks: [-6] })).toThrow(RangeError);
    expect(() => timeToRecovery(episodes, { confLevel: 0 })).toThrow(RangeError);
    expect(() => compareRecoveryBySubgroup([], 'arm', { weeks: [12], minGroupSize: -1 })).toThrow(RangeError);
  });
});

function recoveryObservationOf(e: RecoveryEpisode): Obs | null {
  return recoveryObservation(e.series);
}
