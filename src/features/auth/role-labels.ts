import type { Role } from '../../../shared/roles';

/** How roles read on screen. */
export const ROLE_LABELS: Record<Role, string> = {
  steward: 'Registry steward',
  lead: 'Clinic lead',
  clinician: 'Clinician',
  researcher: 'Researcher',
};

/** "stewards and clinic leads" — for messages that say who a screen is for. */
export function rolesInWords(roles: readonly Role[]): string {
  const plural: Record<Role, string> = {
    steward: 'registry stewards',
    lead: 'clinic leads',
    clinician: 'clinicians',
    researcher: 'researchers',
  };
  const words = roles.map((r) => plural[r]);
  return words.length <= 1 ? (words[0] ?? '') : `${words.slice(0, -1).join(', ')} and ${words.at(-1)}`;
}
