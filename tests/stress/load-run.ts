import { randomBytes } from 'node:crypto';
import type { Db } from '../../server/db/client';
import type { EpisodeDetail } from '../../shared/schemas/episode';
import type { UploadResult } from '../../shared/schemas/upload';
import { createClinic, createUser, TEST_PASSWORD } from '../setup/auth';
import { csv, episodeRows } from '../server/uploads-fixtures';
import { HttpClient, keepAliveAgent, type Answer } from './http-client';
import { Ledger, type AckedEpisode } from './load-ledger';

export type LoadOptions = { url: string; db: Db; clients: number; seconds: number; clinics: number; seed?: number };
export type LoadReport = {
  requests: number;
  byKind: Record<string, { n: number; p50: number; p95: number; max: number }>;
  p95: number;
  status5xx: number;
  unexpected: string[];
  ledger: Ledger;
  clinicIds: number[];
  seconds: number;
};

const FOLLOW_UPS = [['week6', '2025-07-14'], ['week12', '2025-08-25'], ['week26', '2025-12-01']] as const;

/** A new episode as the form sends it (pseudonym-shaped value: the registry only checks the shape). */
const newEpisode = (reference: string) => ({
  pseudonym: randomBytes(32).toString('hex'),
  reference,
  side: 'left',
  startDate: '2025-06-02',
  symptomWeeks: 12,
  ageYears: 48,
  sex: 'female',
  heightCm: 166,
  weightKg: 71.5,
  activityProfile: 'active',
  standingWork: true,
  researchConsent: true,
  baseline: { assessedOn: '2025-06-02', scores: { 'nprs-first-step': 7, 'faam-adl': 55 } },
  interventions: [{ code: 'education-load' }],
});

const quantile = (sorted: number[], q: number) => (sorted.length ? sorted[Math.min(sorted.length - 1, Math.floor(q * sorted.length))]! : 0);

/** A small deterministic generator per client, so a run's mix is repeatable (mulberry32). */
function prng(seed: number) {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/**
 * `clients` signed-in clinicians (spread over `clinics` new clinics) against one listening server for `seconds`:
 * reads (caseload pages, episodes, follow-ups, clinic results), form writes (new episodes, follow-ups, edits under
 * optimistic locking) and small committed CSV uploads. Every answer must be 2xx; every acknowledged write is kept.
 */
export async function runLoad(o: LoadOptions): Promise<LoadReport> {
  const clinicIds: number[] = [];
  for (let c = 0; c < o.clinics; c++) clinicIds.push((await createClinic(o.db, `Load clinic ${c + 1}`)).id);
  const clients: { http: HttpClient; clinicId: number }[] = [];
  for (let i = 0; i < o.clients; i++) {
    const clinicId = clinicIds[i % o.clinics]!;
    const user = await createUser(o.db, 'clinician', clinicId);
    clients.push({ http: new HttpClient(o.url, keepAliveAgent(2)), clinicId });
    await clients.at(-1)!.http.signIn(user.email, TEST_PASSWORD);
  }

  const ledger = new Ledger();
  const times = new Map<string, number[]>();
  const unexpected: string[] = [];
  let status5xx = 0;
  const tag = randomBytes(2).toString('hex').toUpperCase();
  const deadline = performance.now() + o.seconds * 1000;

  const call = async (kind: string, want: number, run: () => Promise<Answer>): Promise<Answer | null> => {
    try {
      const a = await run();
      (times.get(kind) ?? times.set(kind, []).get(kind)!).push(a.ms);
      if (a.status >= 500) status5xx++;
      if (a.status !== want) {
        unexpected.push(`${kind}: ${a.status} ${a.body.toString().slice(0, 200)}`);
        return null;
      }
      return a;
    } catch (e) {
      unexpected.push(`${kind}: ${e instanceof Error ? e.message : String(e)}`);
      return null;
    }
  };

  const worker = async (index: number) => {
    const { http, clinicId } = clients[index]!;
    const rnd = prng((o.seed ?? 1) * 1000 + index);
    const mine: { id: number; acked: AckedEpisode }[] = [];
    let n = 0;
    const create = async () => {
      const reference = `L${tag}c${index}n${n++}`;
      const a = await call('create episode', 201, () => http.post('/api/episodes', newEpisode(reference)));
      if (!a) return;
      const e = a.json<EpisodeDetail>();
      const acked: AckedEpisode = { clinicId, reference, source: 'form', followUps: new Set(), uploadRows: 0, version: e.version, symptomWeeks: e.symptomWeeks };
      ledger.episodes.set(`${clinicId}|${reference}`, acked);
      ledger.ack(clinicId);
      mine.push({ id: e.id, acked });
    };
    await create();
    while (performance.now() < deadline) {
      const r = rnd();
      const own = mine[Math.floor(rnd() * mine.length)];
      if (r < 0.4) {
        await call('caseload page', 200, () => http.get(`/api/episodes?limit=25&offset=${Math.floor(rnd() * 3) * 25}`));
      } else if (r < 0.55 && own) {
        await call('episode', 200, () => http.get(`/api/episodes/${own.id}`));
      } else if (r < 0.62) {
        await call('follow-ups', 200, () => http.get('/api/follow-ups'));
      } else if (r < 0.65) {
        await call('clinic results', 200, () => http.get('/api/analytics/outcomes'));
      } else if (r < 0.8) {
        await create();
      } else if (r < 0.88 && own && own.acked.followUps.size < FOLLOW_UPS.length) {
        const [timepoint, assessedOn] = FOLLOW_UPS[own.acked.followUps.size]!;
        const body = { timepoint, assessedOn, scores: { 'nprs-first-step': 3, 'faam-adl': 75 } };
        if (await call('add follow-up', 201, () => http.post(`/api/episodes/${own.id}/assessments`, body))) {
          own.acked.followUps.add(`${timepoint}|${assessedOn}`);
          ledger.ack(clinicId);
        }
      } else if (r < 0.97 && own) {
        const symptomWeeks = own.acked.symptomWeeks + 1;
        const a = await call('edit episode', 200, () => http.patch(`/api/episodes/${own.id}`, { version: own.acked.version, symptomWeeks }));
        if (a) {
          own.acked.version = a.json<EpisodeDetail>().version;
          own.acked.symptomWeeks = symptomWeeks;
          ledger.ack(clinicId);
        }
      } else {
        const refs = [`U${tag}c${index}n${n++}`, `U${tag}c${index}n${n++}`];
        const data = Buffer.from(csv(refs.flatMap((ref) => episodeRows(ref, 2))));
        const file = { field: 'file', name: 'visits.csv', type: 'text/csv', data };
        const a = await call('upload (6 rows)', 200, () => http.request('POST', '/api/uploads/episodes?dryRun=0', { file }));
        const result = a?.json<UploadResult>();
        if (result?.uploadId) {
          ledger.uploadIds.push(result.uploadId);
          ledger.ack(clinicId);
          for (const reference of refs) {
            ledger.episodes.set(`${clinicId}|${reference}`, { clinicId, reference, source: 'upload', followUps: new Set(), uploadRows: 3, version: 1, symptomWeeks: 16 });
          }
        }
      }
    }
  };
  const started = performance.now();
  await Promise.all(clients.map((_c, i) => worker(i)));
  const seconds = (performance.now() - started) / 1000;
  for (const c of clients) c.http.close();

  const byKind: LoadReport['byKind'] = {};
  const all: number[] = [];
  for (const [kind, list] of times) {
    const s = [...list].sort((a, b) => a - b);
    all.push(...s);
    byKind[kind] = { n: s.length, p50: quantile(s, 0.5), p95: quantile(s, 0.95), max: s.at(-1) ?? 0 };
  }
  all.sort((a, b) => a - b);
  return { requests: all.length, byKind, p95: quantile(all, 0.95), status5xx, unexpected, ledger, clinicIds, seconds };
}

/** The figures as console lines (one per kind) for the test's output. */
export function describeLoad(r: LoadReport, label: string): string {
  const lines = [`${label}: ${r.requests} requests in ${r.seconds.toFixed(1)} s (${(r.requests / r.seconds).toFixed(0)}/s), p95 ${r.p95.toFixed(0)} ms, 5xx ${r.status5xx}, unexpected ${r.unexpected.length}`];
  for (const [kind, k] of Object.entries(r.byKind)) {
    lines.push(`  ${kind.padEnd(16)} n=${String(k.n).padStart(5)}  p50 ${k.p50.toFixed(0).padStart(5)} ms  p95 ${k.p95.toFixed(0).padStart(5)} ms  max ${k.max.toFixed(0).padStart(5)} ms`);
  }
  return lines.join('\n');
}
