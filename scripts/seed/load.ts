import { asc } from 'drizzle-orm';
import { todayUtc } from '../../shared/follow-up-schedule';
import { derivePseudonymKey, pseudonymFor } from '../../shared/pseudonym';
import type { Db } from '../../server/db/client';
import { withClientTransaction } from '../../server/db/client-transaction';
import { clinics } from '../../server/db/schema';
import { audit } from '../../server/services/audit';
import { loadReferenceData } from '../../server/services/reference.service';
import type { Plan, PlannedAssessment, PlannedEpisode } from '../../server/services/uploads-plan';
import { writePlan } from '../../server/services/uploads-write';
import { DEMO_CLINIC_SPECS, generateDemoEpisodes, type DemoEpisode } from './episodes';

/** The demo clinics' passphrase (printed in the README): pseudonyms are made exactly as a clinic would. */
export const DEMO_PASSPHRASE = 'loadline-demo-passphrase';
export const DEMO_EPISODES = 2500;
export const DEMO_SEED = 20260101;

export type DemoEpisodeOptions = { episodes?: number; seed?: number; today?: string };

function planFor(list: DemoEpisode[], pseudonyms: Map<string, string>, codeIds: Map<string, number>): Plan {
  const episodes: PlannedEpisode[] = [];
  const assessments: PlannedAssessment[] = [];
  for (const e of list) {
    const p = e.patient;
    episodes.push({
      reference: e.reference,
      stored: undefined,
      changed: [],
      fields: {
        pseudonym: pseudonyms.get(e.localId)!,
        reference: e.reference,
        conditionCode: 'plantar-heel-pain',
        side: p.side,
        startDate: e.startDate,
        symptomWeeks: p.symptomWeeks,
        ageYears: p.ageYears,
        sex: p.sex,
        heightCm: p.heightCm,
        weightKg: p.weightKg,
        activityProfile: p.activityProfile,
        standingWork: p.standingWork,
        researchConsent: e.researchConsent,
        status: e.status,
        dischargeDate: e.dischargeDate,
        dischargeReason: e.dischargeReason,
      },
      interventions: e.interventions.map((i) => ({ ...i, codeId: codeIds.get(i.code)! })),
    });
    for (const a of e.assessments) {
      assessments.push({ reference: e.reference, episodeId: undefined, stored: undefined, changed: [], ...a });
    }
  }
  return { episodes, assessments, rowsUnchanged: 0, rejectedRows: new Set() };
}

/**
 * Generates the invented episodes for the clinics already in the database and writes them with the
 * upload's batched writer, one transaction (and one audit event per clinic). PBKDF2 runs once per clinic.
 */
export async function loadDemoEpisodes(db: Db, o: DemoEpisodeOptions = {}): Promise<number> {
  const rows = await db.select({ id: clinics.id, code: clinics.code, salt: clinics.pseudonymSalt }).from(clinics).orderBy(asc(clinics.id));
  if (rows.length === 0) return 0;
  const specs = rows.map((c) => DEMO_CLINIC_SPECS.find((s) => s.code === c.code) ?? { code: c.code, weight: 0.1, recoveryFactor: 1 });
  const all = generateDemoEpisodes({ episodes: o.episodes ?? DEMO_EPISODES, seed: o.seed ?? DEMO_SEED, today: o.today ?? todayUtc(), clinics: specs });
  const ref = await loadReferenceData(db);
  const codeIds = new Map([...ref.interventions.values()].map((i) => [i.code, i.id]));
  const plans = await Promise.all(
    rows.map(async (c) => {
      const list = all.filter((e) => e.clinicCode === c.code);
      const key = await derivePseudonymKey(DEMO_PASSPHRASE, c.salt);
      const pseudonyms = new Map<string, string>();
      for (const e of list) if (!pseudonyms.has(e.localId)) pseudonyms.set(e.localId, await pseudonymFor(key, e.localId));
      return { clinic: c, plan: planFor(list, pseudonyms, codeIds), count: list.length };
    }),
  );
  await withClientTransaction(db, async (client, tx) => {
    for (const { clinic, plan, count } of plans) {
      if (count === 0) continue;
      const written = await writePlan(tx, client, clinic.id, null, plan, ref);
      await audit(tx, { actorId: null, clinicId: clinic.id, action: 'create', entity: 'demo-scenario', detail: { ...written, generator: 'scripts/seed', seed: o.seed ?? DEMO_SEED } });
    }
  });
  return all.length;
}
