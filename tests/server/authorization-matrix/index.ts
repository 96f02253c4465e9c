import { adminEntries } from './routes-admin';
import { analyticsEntries } from './routes-analytics';
import { authEntries } from './routes-auth';
import { clinicEntries } from './routes-clinic';
import { researchEntries } from './routes-research';
import type { Entry } from './types';

export * from './types';

/** Every API route with its expectations; one file per area so engineers extend their own. */
export const MATRIX: Entry[] = [
  ...authEntries,
  ...clinicEntries,
  ...analyticsEntries,
  ...researchEntries,
  ...adminEntries,
];
