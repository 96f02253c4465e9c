import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { criteriaSteps, firstFailure } from '../../server/services/cohorts/criteria';
import {
  deriveContext,
  deriveFacts,
  type DeriveContext,
  type EpisodeFacts,
} from '../../server/services/cohorts/derive';
import { loadReference } from '../../server/services/cohorts/reference';
import { scanFacts, withSnapshot } from '../../server/services/cohorts/scan';
import { currentRules } from '../../server/services/rules.service';
import { countingFacts } from '../../server/services/exports/counting-facts';
import { countCohort, verdictOf } from '../../server/services/exports/export-plan';
import { scanExportRows, type ScanNeeds } from '../../server/services/exports/export-scan';
import { decodeRow } from '../../server/services/exports/facts-row-text';
import { CohortCriteriaSchema, type CohortCriteriaInput } from '../../shared/schemas/cohort';
import { testApp } from '../setup/test-app';
import { randomSpecs, seedDataset, type Dataset } from './exports-fixtures';

const ctx = testApp();
let data: Dataset;
let derive: DeriveContext;
let ids: Set<number>;

beforeAll(async () => {
  const specs = randomSpecs(90, 3, 4711);
  // Edge cases of the number text: no interventions, no follow-ups, a discharge recorded before the start.
  specs.push({ ...specs[0]!, interventions: [], followUps: [], consent: true });
  specs.push({ ...specs[1]!, dischargeDay: -3, consent: true });
  data = await seedDataset(ctx.db, ['Scan North', 'Scan, "South"\nEnd', 'Scan East'], specs);
  ids = new Set(data.episodes.map((e) => e.id));
  const [ref, { rules }] = await Promise.all([loadReference(ctx.db), currentRules(ctx.db)]);
  derive = deriveContext(ref, rules);
});
afterAll(() => ctx.close());

/** The facts of this file's episodes, from the cohort engine's own scan. */
async function engineFacts(): Promise<Map<number, EpisodeFacts>> {
  return withSnapshot(ctx.db, async (client) => {
    const out = new Map<number, EpisodeFacts>();
    for await (const batch of scanFacts(client, derive, { scores: true }))
      for (const f of batch) if (ids.has(f.id)) out.set(f.id, f);
    return out;
  });
}

/** The facts of this file's episodes through the export's scan, made with `make`. */
async function exportFacts(needs: ScanNeeds, make = deriveFacts): Promise<Map<number, EpisodeFacts>> {
  return withSnapshot(ctx.db, async (client) => {
    const out = new Map<number, EpisodeFacts>();
    for await (const rows of scanExportRows(client, needs))
      for (const row of rows) if (ids.has(row.id)) out.set(row.id, make(row, derive));
    return out;
  });
}

describe('the export scan', () => {
  it('reads exactly the facts the cohort engine reads, for every consenting episode', async () => {
    const engine = await engineFacts();
    const exported = await exportFacts({ scores: true, interventions: true });
    const consenting = data.episodes.filter((e) => e.consent).map((e) => e.id);
    expect([...exported.keys()].sort((a, b) => a - b)).toEqual(consenting);
    expect(engine.size).toBe(consenting.length);
    for (const [id, f] of engine) expect(exported.get(id), `episode ${id}`).toEqual(f);
    // The odd cases really are in there.
    const facts = [...exported.values()];
    expect(facts.some((f) => f.dischargeDay === -3)).toBe(true);
    expect(facts.some((f) => f.interventionCodes.size === 0)).toBe(true);
    expect(facts.some((f) => f.region === 'Scan, "South"\nEnd')).toBe(true);
  });

  it('gives the counting pass the same fields and cohort membership as deriveFacts', async () => {
    const needs = { scores: false, interventions: true };
    const full = await exportFacts(needs);
    const light = await exportFacts(needs, countingFacts);
    for (const [id, f] of full) {
      const { byInstrument: _b, recovery: _r, assessmentCount: _a, ...fields } = f;
      expect(light.get(id), `episode ${id}`).toMatchObject(fields);
    }
    const cohorts: CohortCriteriaInput[] = [
      { conditionCode: data.condition, sexes: ['female'], activityProfiles: ['runner', 'active'] },
      { ageBands: ['30-34', '35-39', '40-44', '60-64'], bmiBands: ['healthy', 'overweight'] },
      { startFrom: '2023-06-01', startTo: '2024-03-31', durationBands: ['<3m', '>12m'] },
      { addOns: { codes: ['toe-flexor', 'taping'], match: 'all' } },
    ];
    for (const c of cohorts) {
      const steps = criteriaSteps(CohortCriteriaSchema.parse(c));
      const verdicts = [...full].map(
        ([id, f]) => [firstFailure(steps, f), firstFailure(steps, light.get(id)!)] as const,
      );
      for (const [a, b] of verdicts) expect(b).toBe(a);
      expect(new Set(verdicts.map(([a]) => a < 0)).size, JSON.stringify(c)).toBe(2); // some in, some out
    }
  });

  it('stops the file pass when it sees other episodes than the count saw', async () => {
    await withSnapshot(ctx.db, async (client) => {
      const steps = criteriaSteps(CohortCriteriaSchema.parse({ conditionCode: data.condition }));
      const needs = { scores: false, interventions: false };
      const v = await countCohort(client, derive, { steps, granularity: 'year', needs, k: 3 });
      const first = data.episodes.find((e) => e.consent)!;
      // Scan on until this file's first consenting episode: other test files' episodes may come before it.
      let ordinal = -1;
      let found = false;
      for await (const rows of scanExportRows(client, needs)) {
        for (const row of rows) {
          ordinal++;
          if (row.id === first.id) {
            found = true;
            break;
          }
        }
        if (found) break;
      }
      expect(found).toBe(true);
      expect(() => verdictOf(v, ordinal, first.id)).not.toThrow();
      expect(() => verdictOf(v, ordinal, first.id + 1)).toThrow(/did not see the episodes the count saw/);
      expect(() => verdictOf(v, 10 ** 9, first.id)).toThrow(/did not see/);
    });
  });
});

describe('decodeRow', () => {
  const regions = new Map([[7, 'Region, with "quotes"']]);
  const texts = ['plantar-heel-pain', 'female', 'runner', 'both', 'discharged', 'goals-met'];
  const row = (numbers: string, t = texts) => [numbers, ...t].join('\u001f');

  it('reads numbers, the start date, an empty discharge day, the intervention ids and the text fields', () => {
    const read = decodeRow([row('41 7 2024-02-29 52 170.43 65.27 13 1 1 -4 3 11'), '0 1 6 0 3 1 2'], regions);
    expect(read).toMatchObject({ id: 41, clinic_id: 7, region: 'Region, with "quotes"', start_date: '2024-02-29' });
    expect(read).toMatchObject({ age_years: 52, height_cm: 170.43, weight_kg: 65.27, symptom_weeks: 13 });
    expect(read).toMatchObject({
      standing_work: true,
      research_consent: true,
      discharge_day: -4,
      interventions: [3, 11],
    });
    expect(read).toMatchObject({ condition_code: 'plantar-heel-pain', sex: 'female', activity_profile: 'runner', side: 'both' });
    expect(read).toMatchObject({ status: 'discharged', discharge_reason: 'goals-met', scores: '0 1 6 0 3 1 2' });
    const open = decodeRow([row('42 7 2024-03-01 18 155.5 50 0 0 1 ', [...texts.slice(0, 5), '']), null], regions);
    expect(open).toMatchObject({ discharge_day: null, interventions: null, discharge_reason: null, scores: null });
    expect(open).toMatchObject({ standing_work: false, weight_kg: 50 });
  });

  it('refuses a row it cannot read rather than guess', () => {
    expect(() => decodeRow([row('43 8 2024-03-01 18 155.5 50 0 0 1 '), null], regions)).toThrow(/unknown clinic/);
    expect(() => decodeRow([row('44 7 2024-03-01 1x8 155.5 50 0 0 1 '), null], regions)).toThrow(/unexpected/);
    expect(() => decodeRow([row('45 7 2024-03-01 18 155.5 50 0 0 1 ', [...texts, 'extra']), null], regions)).toThrow(/8 fields instead of 7/);
  });
});
