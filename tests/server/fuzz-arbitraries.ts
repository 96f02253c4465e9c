import fc from 'fast-check';
import { eq, sql } from 'drizzle-orm';
import type { Db } from '../../server/db/client';
import { assessments, episodes, instruments, scores } from '../../server/db/schema';
import { EpisodeCreateSchema } from '../../shared/schemas/episode';

/** Values that break things: boundaries, wrong types, odd text, huge and tiny numbers. */
export const nasty = fc.oneof(
  fc.constantFrom<unknown>(
    null, undefined, true, false, 0, -0, -1, 1, 0.5, 15, 16, 110, 111, 99, 100, 229.99, 230, 230.01, 29.9, 300.1, 1040, 1041,
    2 ** 31, -(2 ** 31) - 1, Number.MAX_SAFE_INTEGER, 1e308, -1e308, 5e-324, '', ' ', '0', '7', 'NaN', 'Infinity', '1e3',
    '2026-02-30', '2026-13-01', '0000-00-00', '9999-12-31', '2025-06-02T00:00:00Z', ' 2025-06-02', '02/06/2025',
    'a'.repeat(64), 'A'.repeat(64), 'f'.repeat(63), 'f'.repeat(65), 'g'.repeat(64), 'x'.repeat(10_000),
    'jane.doe@example.org', '+44 20 7946 0958', '1984-03-07', '=HYPERLINK("x")', '@SUM(1)', '-2+3', '\u0000', '\uFFFF',
    '<script>alert(1)</script>', "'; drop table episode; --", '{}', '[]', [], {}, [1, 2], { a: 1 }, { $gt: '' },
  ),
  fc.string({ maxLength: 50 }),
  fc.integer(),
  fc.double(),
  fc.jsonValue({ maxDepth: 2 }),
);

/** A valid new episode (shape of EpisodeCreateSchema) with a unique reference. */
export function validEpisode(reference: string, over: Record<string, unknown> = {}) {
  return {
    pseudonym: 'c0ffee'.padEnd(64, '0'),
    reference,
    side: 'left',
    startDate: '2025-05-05',
    symptomWeeks: 20,
    ageYears: 52,
    sex: 'female',
    heightCm: 164,
    weightKg: 77,
    activityProfile: 'sedentary',
    standingWork: true,
    researchConsent: false,
    baseline: { assessedOn: '2025-05-05', scores: { 'nprs-first-step': 8, 'faam-adl': 50 } },
    interventions: [{ code: 'education-load' }, { code: 'heel-raises', maxLevel: 2 }],
    ...over,
  };
}

/** Valid values at the edges of each field's range, so mutations also produce acceptable requests. */
export const EDGES: Record<string, unknown[]> = {
  symptomWeeks: [0, 1040],
  ageYears: [16, 110],
  heightCm: [100, 230, 150.5],
  weightKg: [30, 300, 45.25],
  startDate: ['2024-02-29', '2025-05-05'],
  side: ['left', 'right', 'both'],
  sex: ['female', 'male', 'other'],
  status: ['open', 'lost'],
  reference: ['A', 'a/b.c_d-e', 'Z'.repeat(40)],
  pseudonym: [' ' + 'AB'.repeat(32) + ' '],
  'baseline.assessedOn': ['2025-05-05', '2026-01-31'],
  'baseline.avgDailySteps': [0, 100_000, null],
  'baseline.adverseEvent': ['', 'skin-irritation', null],
  'interventions.0.maxLevel': [null],
  'interventions.1.startWeek': [0, 104],
  'baseline.scores.nprs-first-step': [0, 10, 9.5],
  'baseline.scores.faam-adl': [0, 100],
  'baseline.scores.lefs': [0, 80],
  'baseline.scores.psfs': [0, 10],
};
const valueFor = (path: string) => (EDGES[path] ? fc.oneof(nasty, fc.constantFrom(...EDGES[path]!)) : nasty);

const FIELDS = [
  'pseudonym', 'reference', 'conditionCode', 'side', 'startDate', 'symptomWeeks', 'ageYears', 'sex', 'heightCm', 'weightKg',
  'activityProfile', 'standingWork', 'researchConsent', 'baseline', 'interventions',
] as const;
const NESTED = ['baseline.assessedOn', 'baseline.reporter', 'baseline.avgDailySteps', 'baseline.adverseEvent', 'baseline.scores', 'interventions.0.code', 'interventions.0.maxLevel', 'interventions.1.startWeek'] as const;
const SCORE_KEYS = ['nprs-first-step', 'nprs-usual', 'faam-adl', 'lefs', 'psfs', 'groc', 'unknown-scale', '', '__proto__', 'constructor'];

function setPath(target: Record<string, unknown>, path: string, value: unknown) {
  const parts = path.split('.');
  let at: Record<string, unknown> = target;
  for (const p of parts.slice(0, -1)) {
    if (typeof at[p] !== 'object' || at[p] === null) at[p] = {};
    at = at[p] as Record<string, unknown>;
  }
  const key = parts.at(-1)!;
  // defineProperty, so a key like "__proto__" becomes an own property that JSON.stringify sends.
  if (value === undefined) delete at[key];
  else Object.defineProperty(at, key, { value, enumerable: true, writable: true, configurable: true });
}

/** A valid episode with one to four fields (top-level, nested or a score) replaced by nasty values, or removed. */
export const mutatedEpisode = (reference: () => string) =>
  fc
    .array(
      fc.oneof(
        fc.constantFrom<string>(...FIELDS, ...NESTED).chain((path) => fc.tuple(fc.constant(path), valueFor(path))),
        fc
          .constantFrom(...SCORE_KEYS)
          .map((k) => `baseline.scores.${k}`)
          .chain((path) => fc.tuple(fc.constant(path), fc.oneof(valueFor(path), fc.double({ min: -20, max: 120 })))),
      ),
      { minLength: 1, maxLength: 4 },
    )
    .map((changes) => {
      const body = structuredClone(validEpisode(reference())) as Record<string, unknown>;
      for (const [path, value] of changes) setPath(body, path, structuredClone(value));
      return body;
    });

/**
 * Every stored episode of the clinic read back and checked as a new one would be: EpisodeCreateSchema on its
 * fields and baseline, and each score inside its instrument's range. Lists what fails.
 */
export async function invalidStoredEpisodes(db: Db, clinicId: number): Promise<string[]> {
  const rows = await db.select().from(episodes).where(eq(episodes.clinicId, clinicId));
  const ranges = new Map((await db.select().from(instruments)).map((i) => [i.id, i]));
  const out: string[] = [];
  for (const e of rows) {
    const [base] = await db.select().from(assessments).where(sql`${assessments.episodeId} = ${e.id} and ${assessments.timepoint} = 'baseline'`);
    const vals = base ? await db.select().from(scores).where(eq(scores.assessmentId, base.id)) : [];
    const input = {
      ...e,
      baseline: base && {
        assessedOn: base.assessedOn,
        reporter: base.reporter,
        avgDailySteps: base.avgDailySteps,
        adverseEvent: base.adverseEvent,
        scores: Object.fromEntries(vals.map((v) => [ranges.get(v.instrumentId)!.code, v.value])),
      },
    };
    const parsed = EpisodeCreateSchema.safeParse(input);
    if (!parsed.success) out.push(`episode ${e.id}: ${parsed.error.issues.map((i) => `${i.path.join('.')} ${i.message}`).join('; ')}`);
    if (base && base.assessedOn < e.startDate) out.push(`episode ${e.id}: baseline before the start`);
    for (const v of vals) {
      const i = ranges.get(v.instrumentId)!;
      if (v.value < i.min || v.value > i.max) out.push(`episode ${e.id}: ${i.code} ${v.value} outside ${i.min}–${i.max}`);
    }
  }
  return out;
}
