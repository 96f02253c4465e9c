import { randomBytes } from 'node:crypto';
import { asc, eq } from 'drizzle-orm';
import type { Express } from 'express';
import type { Db } from '../../../server/db/client';
import { episodes, instruments, interventionCodes, users } from '../../../server/db/schema';
import { createUser, signedInClient, type Client } from '../../setup/auth';
import { randomSpecs, seedDataset, type Dataset } from '../exports-fixtures';
import { approvedRequest } from '../exports-helpers';
import type { Actor, World } from './types';

export type Built = {
  world: World;
  dataset: Dataset;
  emails: Record<Exclude<Actor, 'anon'>, string>;
  /** Text that must never reach a caller: clinic B's rows for clinic A, A's for B, names and identifiers for researchers. */
  markers: { clinicA: RegExp[]; clinicB: RegExp[]; identifying: RegExp[] };
};

const escape = (s: string) => s.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
/** A whole token: "RX1-1" must not match inside "RX1-10". */
const exact = (s: string) => new RegExp(`${escape(s)}(?![\\w-])`);

/** Two clinics of invented episodes (A and B), a person of each role, a cohort and an approved data request. */
export async function buildWorld(db: Db, app: Express): Promise<Built> {
  const dataset = await seedDataset(db, ['Matrix North', 'Matrix South'], randomSpecs(160, 2, 20260518));
  const [a, b] = dataset.clinics;
  const clinicA = { id: a!.id, code: a!.code, displayName: a!.displayName };
  const clinicB = { id: b!.id, code: b!.code, displayName: b!.displayName };
  const mk = async (role: Parameters<typeof createUser>[1], clinicId: number | null) =>
    (await createUser(db, role, clinicId)).email;
  const emails = {
    steward: await mk('steward', null),
    researcher: await mk('researcher', null),
    lead: await mk('lead', clinicA.id),
    clinician: await mk('clinician', clinicA.id),
    otherLead: await mk('lead', clinicB.id),
    otherClinician: await mk('clinician', clinicB.id),
  };
  const firstA = dataset.episodes.find((e) => e.clinic === 0)!;
  const [episodeRow] = await db.select({ version: episodes.version }).from(episodes).where(eq(episodes.id, firstA.id));
  const [pending] = await db
    .insert(users)
    .values({
      email: `pending-${randomBytes(4).toString('hex')}@test.loadline.test`,
      role: 'clinician',
      clinicId: clinicA.id,
    })
    .returning({ id: users.id });
  const spare = await createUser(db, 'clinician', clinicA.id);
  const [instrument] = await db.select({ id: instruments.id }).from(instruments).orderBy(asc(instruments.id)).limit(1);
  const [code] = await db
    .select({ id: interventionCodes.id })
    .from(interventionCodes)
    .orderBy(asc(interventionCodes.id))
    .limit(1);

  const researcher: Client = await signedInClient(app, emails.researcher);
  const steward: Client = await signedInClient(app, emails.steward);
  const dataRequestId = await approvedRequest(researcher, steward, dataset.condition);
  const cohorts = await researcher.get('/api/cohorts');
  const cohortId = (cohorts.body.items as Array<{ id: number }>)[0]!.id;

  let n = 0;
  const world: World = {
    clinicA,
    clinicB,
    episodeA: { id: firstA.id, version: episodeRow!.version, reference: firstA.reference },
    pendingClinicianA: pending!.id,
    spareClinicianA: spare.id,
    userIdA: spare.id,
    cohortId,
    dataRequestId,
    instrumentId: instrument!.id,
    interventionCodeId: code!.id,
    unique: () => `${randomBytes(3).toString('hex')}${n++}`,
  };
  const of = (clinic: number) =>
    dataset.episodes.filter((e) => e.clinic === clinic).flatMap((e) => [exact(e.reference), exact(e.pseudonym)]);
  const markers = {
    clinicA: [exact(clinicA.displayName), ...of(0), exact(emails.lead), exact(emails.clinician)],
    clinicB: [exact(clinicB.displayName), ...of(1), exact(emails.otherLead), exact(emails.otherClinician)],
    identifying: [exact(clinicA.displayName), exact(clinicB.displayName), ...of(0), ...of(1)],
  };
  return { world, dataset, emails, markers };
}
