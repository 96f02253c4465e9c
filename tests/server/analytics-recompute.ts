import { sql } from 'drizzle-orm';
import {
  classifyResponder,
  recoveryObservation,
  type Assessment,
  type Obs,
  type ResponderStatus,
} from '../../analysis/index';
import { RegistryRulesSchema, type RegistryRules } from '../../shared/rules';
import type { Db } from '../../server/db/client';

/**
 * An independent recomputation for the analytics tests: plain selects of the stored rows, then the
 * analysis/ functions on each episode's series. Nothing from server/services/analytics is used, so a
 * mistake in the endpoints' SQL reduction shows up as a mismatch.
 */

export type PlainInstrument = {
  id: number;
  code: string;
  min: number;
  max: number;
  higherIsBetter: boolean;
  mcid: number | null;
};
export type PlainEpisode = {
  id: number;
  clinicId: number;
  clinicActive: boolean;
  startDate: string;
  consent: boolean;
  quarter: string;
  activity: string;
  sex: string;
  symptomWeeks: number;
  ageYears: number;
  heightCm: number;
  weightKg: number;
  /** Assessments (weeks since start, in entry order), with scores by instrument id. */
  assessments: { id: number; weeks: number; days: number; timepoint: string; scores: Map<number, number> }[];
  addOns: string[];
};

export type Registry = {
  rules: RegistryRules;
  rulesVersion: number;
  instruments: PlainInstrument[];
  episodes: PlainEpisode[];
  today: string;
};

const dayDiff = (a: string, b: string) =>
  Math.round((Date.parse(`${a}T00:00:00Z`) - Date.parse(`${b}T00:00:00Z`)) / 86_400_000);

export async function loadRegistry(db: Db): Promise<Registry> {
  const q = async <T>(s: ReturnType<typeof sql>) => (await db.execute(s)).rows as T[];
  const [rulesRow] = await q<{ version: number; rules: unknown }>(
    sql`select version, rules from registry_rules order by version desc limit 1`,
  );
  const instruments = (
    await q<{ id: number; code: string; min: number; max: number; higher_is_better: boolean; mcid: number | null }>(
      sql`select id, code, min, max, higher_is_better, mcid from instrument order by id`,
    )
  ).map((i) => ({
    id: i.id,
    code: i.code,
    min: Number(i.min),
    max: Number(i.max),
    higherIsBetter: i.higher_is_better,
    mcid: i.mcid === null ? null : Number(i.mcid),
  }));
  const eps = await q<{
    id: number;
    clinic_id: number;
    active: boolean;
    start_date: string;
    research_consent: boolean;
    activity_profile: string;
    sex: string;
    symptom_weeks: number;
    age_years: number;
    height_cm: number;
    weight_kg: number;
  }>(
    sql`select e.id, e.clinic_id, c.active, e.start_date::text as start_date, e.research_consent, e.activity_profile, e.sex, e.symptom_weeks,
          e.age_years, e.height_cm, e.weight_kg
        from episode e join clinic c on c.id = e.clinic_id order by e.id`,
  );
  const as = await q<{ id: number; episode_id: number; assessed_on: string; timepoint: string }>(
    sql`select id, episode_id, assessed_on::text as assessed_on, timepoint from assessment order by id`,
  );
  const ss = await q<{ assessment_id: number; instrument_id: number; value: number }>(
    sql`select assessment_id, instrument_id, value from score`,
  );
  const ads = await q<{ episode_id: number; code: string }>(
    sql`select ei.episode_id, ic.code from episode_intervention ei join intervention_code ic on ic.id = ei.intervention_code_id where ic.kind = 'addon'`,
  );
  const [{ today }] = (await q<{ today: string }>(sql`select current_date::text as today`)) as [{ today: string }];
  const byId = new Map<number, PlainEpisode>();
  for (const e of eps) {
    const month = Number(e.start_date.slice(5, 7));
    byId.set(e.id, {
      id: e.id,
      clinicId: e.clinic_id,
      clinicActive: e.active,
      startDate: e.start_date,
      consent: e.research_consent,
      quarter: `${e.start_date.slice(0, 4)}-Q${Math.ceil(month / 3)}`,
      activity: e.activity_profile,
      sex: e.sex,
      symptomWeeks: e.symptom_weeks,
      ageYears: e.age_years,
      heightCm: Number(e.height_cm),
      weightKg: Number(e.weight_kg),
      assessments: [],
      addOns: [],
    });
  }
  const aById = new Map<number, PlainEpisode['assessments'][number]>();
  for (const a of as) {
    const e = byId.get(a.episode_id)!;
    const days = dayDiff(a.assessed_on, e.startDate);
    if (days < 0) continue;
    const row = { id: a.id, weeks: days / 7, days, timepoint: a.timepoint, scores: new Map<number, number>() };
    e.assessments.push(row);
    aById.set(a.id, row);
  }
  for (const s of ss) aById.get(s.assessment_id)?.scores.set(s.instrument_id, Number(s.value));
  for (const a of ads) byId.get(a.episode_id)?.addOns.push(a.code);
  return {
    rules: RegistryRulesSchema.parse(rulesRow!.rules),
    rulesVersion: rulesRow!.version,
    instruments,
    episodes: [...byId.values()],
    today,
  };
}

export function series(e: PlainEpisode, instrumentId: number): Assessment[] {
  return e.assessments
    .filter((a) => a.scores.has(instrumentId))
    .map((a) => ({ weeks: a.weeks, value: a.scores.get(instrumentId)! }));
}

export function baselineOf(e: PlainEpisode, instrumentId: number): number | null {
  return e.assessments.find((a) => a.timepoint === 'baseline')?.scores.get(instrumentId) ?? null;
}

export function recoveryOf(reg: Registry, e: PlainEpisode): Obs | null {
  const inst = reg.instruments.find((i) => i.code === reg.rules.recovery.instrumentCode)!;
  return recoveryObservation(series(e, inst.id), {
    threshold: reg.rules.recovery.threshold,
    direction: inst.higherIsBetter ? 'atLeast' : 'atMost',
  });
}

export function responderOf(reg: Registry, e: PlainEpisode, inst: PlainInstrument): ResponderStatus {
  const w = reg.rules.primaryWindow;
  return classifyResponder(
    { baseline: baselineOf(e, inst.id), assessments: series(e, inst.id) },
    {
      higherIsBetter: inst.higherIsBetter,
      threshold: inst.mcid!,
      window: { target: w.targetWeek, from: w.fromWeek, to: w.toWeek },
    },
  ).status;
}

export function week12Completeness(reg: Registry, e: PlainEpisode): { due: boolean; done: boolean } {
  const { fromDay, toDay } = reg.rules.followUpWindows.week12;
  const due = dayDiff(reg.today, e.startDate) > toDay;
  const done = e.assessments.some((a) => a.timepoint !== 'baseline' && a.days >= fromDay && a.days <= toDay);
  return { due, done };
}

/** Deep equality with numbers compared to 1e-9 relative (sums taken in another row order differ in the last bits). */
export function closeTo(actual: unknown, expected: unknown, path = '$'): string[] {
  if (typeof expected === 'number' && typeof actual === 'number') {
    return Math.abs(actual - expected) <= 1e-9 * Math.max(1, Math.abs(expected))
      ? []
      : [`${path}: ${actual} ≠ ${expected}`];
  }
  if (expected === null || typeof expected !== 'object')
    return Object.is(actual, expected) ? [] : [`${path}: ${String(actual)} ≠ ${String(expected)}`];
  if (actual === null || typeof actual !== 'object') return [`${path}: ${String(actual)} is not an object`];
  const keys = new Set([...Object.keys(expected), ...Object.keys(actual)]);
  return [...keys].flatMap((k) =>
    closeTo((actual as Record<string, unknown>)[k], (expected as Record<string, unknown>)[k], `${path}.${k}`),
  );
}
