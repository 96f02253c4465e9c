import { describe, it, expect } from 'vitest';
import { clinicComparison, funnelPoint, recoveredByWeek, funnelLimits } from '../../analysis/index';
import type { ClinicEpisode } from '../../analysis/index';
import ref from '../fixtures/stats/funnel-limits.json';
import { expectClose } from './helpers/close';

const p06n10 = ref.limits.find((l) => l.target_p0 === 0.6 && l.n === 10);

function clinic(name: string, n: number, responders: number, recovered: number): ClinicEpisode[] {
  return Array.from({ length: n }, (_, i) => ({
    clinic: name,
    responder: i < responders,
    recoveredBy12: i < recovered,
  }));
}

describe('funnelPoint: Spiegelhalter 2005 exact limits around a target', () => {
  it('n = 10, target 0.6: limits from the reference table; 9/10 is above the 95% but within the 99.8% limits', () => {
    const p = funnelPoint([...Array<boolean>(9).fill(true), false], 0.6);
    expectClose(p.limits95?.lower, p06n10?.exact_95[0] ?? null);
    expectClose(p.limits95?.upper, p06n10?.exact_95[1] ?? null);
    expectClose(p.limits998?.upper, p06n10?.['exact_99.8'][1] ?? null);
    expect(p).toMatchObject({ n: 10, count: 9, nMissing: 0, share: 0.9, flag95: 'above', flag998: 'within' });
  });
  it('2/10 is below the 95% limit (0.229918) and within 99.8% (0.056912)', () => {
    const p = funnelPoint([true, true, ...Array<boolean>(8).fill(false)], 0.6);
    expect(p).toMatchObject({ flag95: 'below', flag998: 'within' });
  });
  it('missing outcomes are counted and excluded; no known outcome gives null limits', () => {
    expect(funnelPoint([true, null, false], 0.5)).toMatchObject({ n: 2, count: 1, nMissing: 1, share: 0.5 });
    expect(funnelPoint([null, null], 0.5)).toMatchObject({ n: 0, share: null, limits95: null, flag95: null });
    expect(funnelPoint([true], null)).toMatchObject({ limits95: null, flag998: null });
  });
});

describe('recoveredByWeek', () => {
  it('event by the week: true; followed past it without event: false; censored before: unknown', () => {
    expect(recoveredByWeek({ time: 8, event: true }, 12)).toBe(true);
    expect(recoveredByWeek({ time: 12, event: true }, 12)).toBe(true);
    expect(recoveredByWeek({ time: 14, event: true }, 12)).toBe(false);
    expect(recoveredByWeek({ time: 12, event: false }, 12)).toBe(false);
    expect(recoveredByWeek({ time: 6, event: false }, 12)).toBeNull();
    expect(() => recoveredByWeek({ time: 6, event: false }, -1)).toThrow(RangeError);
  });
});

describe('clinicComparison', () => {
  const episodes = Object.freeze([
    ...clinic('B', 10, 9, 5),
    ...clinic('A', 10, 2, 6),
    ...clinic('C', 40, 24, 24),
    { clinic: 'C', responder: null, recoveredBy12: null },
  ]);
  it('with an explicit target: per-clinic n, share, both limit pairs and flags; clinics sorted', () => {
    const r = clinicComparison(episodes, { responderTarget: 0.6, recoveryTarget: 0.6 });
    expect(r.clinics.map((c) => c.clinic)).toEqual(['A', 'B', 'C']);
    expect(r.clinics[0]?.responder).toMatchObject({ n: 10, count: 2, flag95: 'below', flag998: 'within' });
    expect(r.clinics[1]?.responder).toMatchObject({ n: 10, count: 9, flag95: 'above', flag998: 'within' });
    expect(r.clinics[2]?.responder).toMatchObject({ n: 40, count: 24, nMissing: 1, flag95: 'within' });
    expect(r.clinics[2]?.nEpisodes).toBe(41);
    expect(r.clinics[2]?.responder.limits998).toEqual(funnelLimits(0.6, 40, 0.998));
  });
  it('default target is the pooled share over all clinics', () => {
    const r = clinicComparison(episodes);
    expectClose(r.targets.responder, 35 / 60, 1e-12);
    expectClose(r.targets.recoveredBy12, 35 / 60, 1e-12);
  });
  it('throws RangeError for a target outside (0, 1) or an empty clinic name', () => {
    expect(() => clinicComparison(episodes, { responderTarget: 1 })).toThrow(RangeError);
    expect(() => clinicComparison([{ clinic: '', responder: true, recoveredBy12: true }])).toThrow(RangeError);
  });
});
