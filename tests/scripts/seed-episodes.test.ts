import { describe, expect, it } from 'vitest';
import { EpisodeReferenceSchema } from '../../shared/schemas/episode';
import { DEFAULT_RULES } from '../../shared/rules';
import { daysBetween } from '../../shared/follow-up-schedule';
import { DEMO_CLINIC_SPECS, generateDemoEpisodes } from '../../scripts/seed/episodes';

const TODAY = '2026-06-15';
const all = generateDemoEpisodes({ episodes: 2500, seed: 20260101, today: TODAY, clinics: DEMO_CLINIC_SPECS });
const mean = (xs: number[]) => xs.reduce((a, b) => a + b, 0) / xs.length;
const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!;

describe('demo episode generator (invented data)', () => {
  it('is deterministic from its seed, and another seed gives another registry', () => {
    const again = generateDemoEpisodes({ episodes: 2500, seed: 20260101, today: TODAY, clinics: DEMO_CLINIC_SPECS });
    expect(JSON.stringify(again)).toBe(JSON.stringify(all));
    const other = generateDemoEpisodes({ episodes: 2500, seed: 7, today: TODAY, clinics: DEMO_CLINIC_SPECS });
    expect(JSON.stringify(other)).not.toBe(JSON.stringify(all));
  });

  it('spreads episodes over two years up to today, across the six clinics, with valid references', () => {
    const ages = all.map((e) => daysBetween(e.startDate, TODAY));
    expect(Math.min(...ages)).toBeGreaterThanOrEqual(0);
    expect(Math.max(...ages)).toBeLessThan(730);
    expect(new Set(all.map((e) => e.clinicCode)).size).toBe(6);
    for (const e of all.slice(0, 200)) expect(EpisodeReferenceSchema.safeParse(e.reference).success, e.reference).toBe(true);
    expect(all.every((e) => e.assessments.every((a) => a.assessedOn <= TODAY))).toBe(true);
  });

  it('has the case-mix: runners younger and leaner than sedentary patients; about 85% research consent', () => {
    const of = (p: string) => all.filter((e) => e.patient.activityProfile === p).map((e) => e.patient);
    expect(mean(of('runner').map((p) => p.ageYears))).toBeLessThan(mean(of('sedentary').map((p) => p.ageYears)) - 10);
    expect(mean(of('runner').map((p) => p.bmi))).toBeLessThan(mean(of('sedentary').map((p) => p.bmi)) - 4);
    const consent = mean(all.map((e) => (e.researchConsent ? 1 : 0)));
    expect(consent).toBeGreaterThan(0.82);
    expect(consent).toBeLessThan(0.88);
  });

  it('recovers most patients in about three months, chronic ones slower, with a long tail', () => {
    const weeks = all.map((e) => e.recoveryWeeks);
    expect(median(weeks)).toBeGreaterThan(10);
    expect(median(weeks)).toBeLessThan(16);
    expect(weeks.filter((w) => w > 26).length / weeks.length).toBeGreaterThan(0.05);
    const chronic = all.filter((e) => e.patient.chronic).map((e) => e.recoveryWeeks);
    const acute = all.filter((e) => !e.patient.chronic).map((e) => e.recoveryWeeks);
    expect(median(chronic)).toBeGreaterThan(median(acute) * 1.3);
  });

  it('loses 15–30% to follow-up at week 12, with follow-ups inside the rules’ windows', () => {
    const w = DEFAULT_RULES.followUpWindows.week12;
    const due = all.filter((e) => daysBetween(e.startDate, TODAY) > w.toDay && !(e.status === 'discharged' && daysBetween(e.startDate, e.dischargeDate!) < w.fromDay));
    const missing = due.filter((e) => !e.assessments.some((a) => a.timepoint === 'week12')).length / due.length;
    expect(missing).toBeGreaterThan(0.15);
    expect(missing).toBeLessThan(0.3);
    for (const e of all) {
      for (const a of e.assessments.filter((x) => x.timepoint !== 'baseline')) {
        const win = DEFAULT_RULES.followUpWindows[a.timepoint as 'week6' | 'week12' | 'week26'];
        const d = daysBetween(e.startDate, a.assessedOn);
        expect(d >= win.fromDay && d <= win.toDay).toBe(true);
      }
    }
  });

  it('leaves open episodes with follow-ups due and overdue today', () => {
    const open = all.filter((e) => e.status === 'open');
    const inWeek12Window = open.filter((e) => {
      const d = daysBetween(e.startDate, TODAY);
      return d >= 70 && d <= 112 && !e.assessments.some((a) => a.timepoint === 'week12');
    });
    const overdue = open.filter((e) => daysBetween(e.startDate, TODAY) > 112 && !e.assessments.some((a) => a.timepoint === 'week12'));
    expect(inWeek12Window.length).toBeGreaterThan(20);
    expect(overdue.length).toBeGreaterThan(20);
  });

  it('gives add-ons more often to chronic and sedentary cases (confounding by indication)', () => {
    const addOns = (e: (typeof all)[number]) => e.interventions.filter((i) => !['education-load', 'fascia-stretch', 'heel-raises'].includes(i.code)).length;
    const chronicSedentary = all.filter((e) => e.patient.chronic && e.patient.activityProfile === 'sedentary').map(addOns);
    const acuteRunners = all.filter((e) => !e.patient.chronic && e.patient.activityProfile === 'runner').map(addOns);
    expect(mean(chronicSedentary)).toBeGreaterThan(mean(acuteRunners) + 1);
    expect(all.every((e) => e.interventions.every((i) => i.maxLevel === null || ['heel-raises', 'split-squats', 'single-leg-balance'].includes(i.code)))).toBe(true);
  });

  it('scores first-step and usual pain, FAAM ADL at every assessment and GROC at follow-ups, all in range', () => {
    for (const e of all) {
      for (const a of e.assessments) {
        expect(Object.keys(a.scores).sort()).toEqual(a.timepoint === 'baseline' ? ['faam-adl', 'nprs-first-step', 'nprs-usual'] : ['faam-adl', 'groc', 'nprs-first-step', 'nprs-usual']);
        expect(a.scores['nprs-first-step']).toBeGreaterThanOrEqual(0);
        expect(a.scores['nprs-first-step']).toBeLessThanOrEqual(10);
        if (a.scores.groc !== undefined) expect(Math.abs(a.scores.groc)).toBeLessThanOrEqual(7);
      }
    }
  });
});
