import type { SessionUser } from '../../shared/auth';

/**
 * Whose rows a caller may see. Every service query for clinic data takes a Scope and applies it
 * (see `clinicFilter` helpers in the services); routes never build their own clinic condition.
 * - clinic: lead and clinician, their own clinic only;
 * - registry: steward (all clinics) and researcher (all clinics, consenting episodes only, no identifiers).
 */
export type Scope =
  | { kind: 'clinic'; clinicId: number; userId: number }
  | { kind: 'registry'; researcher: boolean; userId: number };

export function scopeOf(user: SessionUser): Scope {
  if (user.role === 'lead' || user.role === 'clinician') {
    if (user.clinicId == null) throw new Error(`user ${user.id} has a clinic role but no clinic`);
    return { kind: 'clinic', clinicId: user.clinicId, userId: user.id };
  }
  return { kind: 'registry', researcher: user.role === 'researcher', userId: user.id };
}
