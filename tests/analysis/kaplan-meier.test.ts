import { describe, it, expect } from 'vitest';
import { kaplanMeier } from '../../analysis/index';
import type { ConfType, KaplanMeierStep, Obs } from '../../analysis/index';
import freireich from '../fixtures/stats/kaplan-meier-freireich.json';
import bewick from '../fixtures/stats/kaplan-meier-bewick.json';
import { expectClose } from './helpers/close';
import { sixMp, placebo } from './helpers/freireich';

type Row = {
  time: number;
  n_risk: number;
  n_event: number;
  n_censor_at_time: number;
  survival: number;
  std_err: number | null;
  ci_log: (number | null)[];
  ci_loglog: (number | null)[];
  ci_plain: (number | null)[];
};
const ciKey: Record<ConfType, 'ci_log' | 'ci_loglog' | 'ci_plain'> = {
  log: 'ci_log',
  'log-log': 'ci_loglog',
  plain: 'ci_plain',
};

function checkEventRows(steps: KaplanMeierStep[], rows: readonly Row[], confType: ConfType): void {
  const eventSteps = steps.filter((s) => s.nEvent > 0);
  expect(eventSteps.map((s) => s.time)).toEqual(rows.map((r) => r.time));
  eventSteps.forEach((s, i) => {
    const r = rows[i] as Row;
    expect(s.nRisk).toBe(r.n_risk);
    expect(s.nEvent).toBe(r.n_event);
    expect(s.nCensor).toBe(r.n_censor_at_time);
    expectClose(s.survival, r.survival);
    if (r.std_err === null) expect(s.stdErr).toBeNaN();
    else expectClose(s.stdErr, r.std_err);
    const [lo, up] = r[ciKey[confType]];
    expectClose(s.lower, lo ?? null);
    expectClose(s.upper, up ?? null);
  });
}

describe('kaplanMeier: Freireich et al. 1963 6-MP data (R survival 3.5.3 / scipy values)', () => {
  for (const confType of ['log', 'log-log', 'plain'] as const) {
    it(`6-MP arm, ${confType} CI`, () => {
      const km = kaplanMeier(sixMp, { confType });
      checkEventRows(km.steps, freireich.results['6-MP'].event_rows, confType);
    });
    it(`placebo arm, ${confType} CI (S = 0 at week 23: NaN SE, null bounds)`, () => {
      const km = kaplanMeier(placebo, { confType });
      checkEventRows(km.steps, freireich.results.placebo.event_rows, confType);
      const last = km.steps.at(-1);
      expect(last?.survival).toBe(0);
      expect(last?.stdErr).toBeNaN();
      expect(last?.lower).toBeNull();
      expect(last?.upper).toBeNull();
    });
    it(`medians and their CIs, ${confType}`, () => {
      for (const [arm, obs] of [
        ['6-MP', sixMp],
        ['placebo', placebo],
      ] as const) {
        const ref = freireich.results[arm].median;
        const ci = ref[`ci95_${confType}` as 'ci95_log' | 'ci95_log-log' | 'ci95_plain'];
        const km = kaplanMeier(obs, { confType });
        expect(km.median).toEqual({ estimate: ref.estimate, lower: ci[0] ?? null, upper: ci[1] ?? null });
      }
    });
  }

  it('default is log-log at 95%', () => {
    expect(kaplanMeier(sixMp)).toEqual(kaplanMeier(sixMp, { confLevel: 0.95, confType: 'log-log' }));
  });

  it('one step per distinct time, censor-only times carry the previous values', () => {
    const km = kaplanMeier(sixMp, { confType: 'log' });
    const distinct = [...new Set(sixMp.map((o) => o.time))].sort((a, b) => a - b);
    expect(km.steps.map((s) => s.time)).toEqual(distinct);
    const at9 = km.steps.find((s) => s.time === 9);
    const at7 = km.steps.find((s) => s.time === 7);
    expect(at9).toMatchObject({ nRisk: 16, nEvent: 0, nCensor: 1 });
    expect({ ...at9, time: 0, nRisk: 0, nCensor: 0 }).toEqual({ ...at7, time: 0, nRisk: 0, nCensor: 0, nEvent: 0 });
    // 32+ twice: one step with nCensor 2
    expect(km.steps.find((s) => s.time === 32)).toMatchObject({ nRisk: 4, nEvent: 0, nCensor: 2 });
  });

  it('ties: events at t are removed before censorings at t (week 6: 21 at risk, 3 events, 1 censored)', () => {
    const first = kaplanMeier(sixMp).steps[0];
    expect(first).toMatchObject({ time: 6, nRisk: 21, nEvent: 3, nCensor: 1 });
    expectClose(first?.survival, 18 / 21);
  });

  it('a lower confidence level narrows the interval', () => {
    const wide = kaplanMeier(sixMp, { confLevel: 0.95, confType: 'log' }).steps[3] as KaplanMeierStep;
    const narrow = kaplanMeier(sixMp, { confLevel: 0.9, confType: 'log' }).steps[3] as KaplanMeierStep;
    expect(narrow.survival).toBe(wide.survival);
    expect(narrow.lower ?? 0).toBeGreaterThan(wide.lower ?? 0);
    expect(narrow.upper ?? 0).toBeLessThan(wide.upper ?? 0);
  });

  it('does not modify frozen input', () => {
    const frozen = Object.freeze(sixMp.map((o) => Object.freeze({ ...o })));
    expect(() => kaplanMeier(frozen)).not.toThrow();
    expect(frozen.map((o) => o.time)).toEqual(freireich.data['6-MP'].time);
  });

  it('large input (radix-sort path, > 65 536 observations): 6-MP data replicated 5 000 times keeps S(t)', () => {
    const big: Obs[] = [];
    for (let r = 0; r < 5000; r++) for (const o of sixMp) big.push(o);
    // shuffle deterministically so the sort has work to do
    let seed = 7;
    for (let i = big.length - 1; i > 0; i--) {
      seed = (seed * 16807) % 2147483647;
      const j = seed % (i + 1);
      [big[i], big[j]] = [big[j] as Obs, big[i] as Obs];
    }
    const km = kaplanMeier(big, { confType: 'log' });
    const rows = freireich.results['6-MP'].event_rows;
    const eventSteps = km.steps.filter((s) => s.nEvent > 0);
    expect(eventSteps.map((s) => s.time)).toEqual(rows.map((r) => r.time));
    eventSteps.forEach((s, i) => {
      expect(s.nRisk).toBe((rows[i]?.n_risk ?? 0) * 5000);
      expectClose(s.survival, rows[i]?.survival ?? null);
    });
    expect(km.median.estimate).toBe(23);
  });
});

describe('kaplanMeier: Bewick, Cheek & Ball 2004 Table 2 example', () => {
  const obs: Obs[] = bewick.data.time.map((time, i) => ({ time, event: bewick.data.status[i] === 1 }));

  for (const confType of ['log', 'log-log', 'plain'] as const) {
    it(`rows match, ${confType}`, () => {
      checkEventRows(kaplanMeier(obs, { confType }).steps, bewick.event_rows, confType);
    });
    it(`median 7 by the midpoint rule (S = 0.5 exactly on [5, 9)); CI ${confType} as R print.survfit`, () => {
      const km = kaplanMeier(obs, { confType });
      const [lo, up] = bewick.median_ci95[confType];
      expect(km.median).toEqual({ estimate: bewick.median, lower: lo ?? null, upper: up ?? null });
    });
  }

  it('printed survival values (3 decimals) agree', () => {
    const steps = kaplanMeier(obs).steps.filter((s) => s.nEvent > 0);
    bewick.printed_survival.forEach(([time, s], i) => {
      expect(steps[i]?.time).toBe(time);
      expect(Math.abs((steps[i]?.survival ?? NaN) - (s ?? NaN))).toBeLessThan(5e-4);
    });
  });
});

describe('kaplanMeier: median rule edge cases (checked against R survival 3.5.3 print.survfit)', () => {
  it('S = 0.5 flat to the last (censored) time: the median is that time', () => {
    // R: survfit(Surv(c(1,2,3,4), c(1,1,0,0)) ~ 1) prints median 2, 0.95LCL 1
    const km = kaplanMeier(
      [1, 2, 3, 4].map((time, i) => ({ time, event: i < 2 })),
      { confType: 'log' },
    );
    expect(km.median).toEqual({ estimate: 2, lower: 1, upper: null });
  });
  it('S = 0.5 then a later event: midpoint with the next event time, skipping censorings', () => {
    // R: times 1..10, events at 1-5 and 10 -> median 7.5, 0.95LCL 3
    const km = kaplanMeier(
      [1, 2, 3, 4, 5, 6, 7, 8, 9, 10].map((time, i) => ({ time, event: i < 5 || i === 9 })),
      { confType: 'log' },
    );
    expect(km.median).toEqual({ estimate: 7.5, lower: 3, upper: null });
  });
  it('two events, S reaches 0.5 then 0: median 1.5', () => {
    // R: survfit(Surv(c(1,2), c(1,1)) ~ 1) prints median 1.5, 0.95LCL 1
    expect(
      kaplanMeier(
        [
          { time: 1, event: true },
          { time: 2, event: true },
        ],
        { confType: 'log' },
      ).median,
    ).toEqual({
      estimate: 1.5,
      lower: 1,
      upper: null,
    });
  });
});

describe('kaplanMeier: edge cases', () => {
  it('all censored: S stays 1, SE 0, median not reached; log-log bounds null while S = 1', () => {
    const obs = [3, 5, 5, 8].map((time) => ({ time, event: false }));
    const km = kaplanMeier(obs);
    expect(km.steps.map((s) => [s.time, s.nRisk, s.nCensor, s.survival, s.stdErr])).toEqual([
      [3, 4, 1, 1, 0],
      [5, 3, 2, 1, 0],
      [8, 1, 1, 1, 0],
    ]);
    expect(km.steps.every((s) => s.lower === null && s.upper === null)).toBe(true);
    expect(km.median).toEqual({ estimate: null, lower: null, upper: null });
    // log and plain bounds are defined (both 1) while S = 1
    expect(kaplanMeier(obs, { confType: 'log' }).steps[0]).toMatchObject({ lower: 1, upper: 1 });
    expect(kaplanMeier(obs, { confType: 'plain' }).steps[0]).toMatchObject({ lower: 1, upper: 1 });
  });

  it('all events at one time: S = 0, NaN SE, null bounds; median is that time, its limits undefined', () => {
    // R: survfit(Surv(c(3,3,3), c(1,1,1)) ~ 1): median 3, limits NA
    const km = kaplanMeier([3, 3, 3].map((time) => ({ time, event: true })));
    expect(km.steps).toHaveLength(1);
    expect(km.steps[0]).toMatchObject({
      time: 3,
      nRisk: 3,
      nEvent: 3,
      nCensor: 0,
      survival: 0,
      lower: null,
      upper: null,
    });
    expect(km.steps[0]?.stdErr).toBeNaN();
    expect(km.median).toEqual({ estimate: 3, lower: null, upper: null });
  });

  it('single observation; time 0 and -0 are accepted', () => {
    expect(kaplanMeier([{ time: 0, event: true }]).steps[0]).toMatchObject({ time: 0, survival: 0 });
    const km = kaplanMeier([
      { time: -0, event: false },
      { time: 0, event: true },
      { time: 1, event: false },
    ]);
    expect(km.steps.map((s) => [s.time, s.nEvent, s.nCensor])).toEqual([
      [0, 1, 1],
      [1, 0, 1],
    ]);
  });

  it('throws RangeError on empty input', () => {
    expect(() => kaplanMeier([])).toThrow(RangeError);
  });
  it.each([[-1], [NaN], [Infinity], [-Infinity]])('throws RangeError for time %s', (time) => {
    expect(() =>
      kaplanMeier([
        { time: 1, event: true },
        { time, event: true },
      ]),
    ).toThrow(RangeError);
  });
  it('throws RangeError for a non-boolean event flag or non-number time', () => {
    expect(() => kaplanMeier([{ time: 1, event: 1 as unknown as boolean }])).toThrow(RangeError);
    expect(() => kaplanMeier([{ time: '3' as unknown as number, event: true }])).toThrow(RangeError);
  });
  it.each([[0], [1], [-0.5], [1.5], [NaN], [95]])('throws RangeError for confLevel %s', (confLevel) => {
    expect(() => kaplanMeier(sixMp, { confLevel })).toThrow(RangeError);
  });
  it('throws RangeError for an unknown confType', () => {
    expect(() => kaplanMeier(sixMp, { confType: 'arcsine' as ConfType })).toThrow(RangeError);
  });
});
