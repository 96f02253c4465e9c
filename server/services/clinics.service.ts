import { eq } from 'drizzle-orm';
import { clinics } from '../db/schema';
import { ForbiddenError, NotFoundError } from '../errors';
import type { Tx } from './audit';

/**
 * The guard of every submission path (episode create/update, assessments, interventions, CSV commit):
 * a deactivated clinic keeps its data but accepts nothing new. Call it inside the write transaction;
 * `FOR SHARE` makes a concurrent deactivation wait for this transaction, so nothing slips in after it.
 */
export async function assertClinicAccepts(tx: Tx, clinicId: number): Promise<void> {
  const [row] = await tx
    .select({ code: clinics.code, active: clinics.active })
    .from(clinics)
    .where(eq(clinics.id, clinicId))
    .for('share');
  if (!row) throw new NotFoundError('No such clinic');
  if (!row.active) {
    throw new ForbiddenError(
      `Clinic ${row.code} is deactivated and no longer accepts submissions; its stored data is kept. Ask the registry steward.`,
    );
  }
}
