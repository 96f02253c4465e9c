/** The four roles of the registry (codes only; labels live in the client). */
export const ROLES = ['steward', 'lead', 'clinician', 'researcher'] as const;
export type Role = (typeof ROLES)[number];

/** Roles that belong to exactly one clinic; steward and researcher belong to none. */
export const CLINIC_ROLES: readonly Role[] = ['lead', 'clinician'];
