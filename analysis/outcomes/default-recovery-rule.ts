import type { RecoveryRule } from './types';

/**
 * Default recovery rule: first-step morning pain (NPRS 0–10) at most 2/10.
 * Common practice, no published source; make it configurable per report.
 */
export const DEFAULT_RECOVERY_RULE: RecoveryRule = Object.freeze({ threshold: 2, direction: 'atMost' });
