// Invented answers of the registry's API for the client tests (the server is tested in tests/server).
// Instrument rows mirror the shipped reference data (drizzle/0005_reference_data.sql).

export const instruments = [
  { id: 1, code: 'nprs-first-step', label: 'Pain on first steps in the morning (0–10)', unit: 'points', min: 0, max: 10, higherIsBetter: false, mcid: 2, mcidSource: 'Farrar 2001', retired: false },
  { id: 3, code: 'faam-adl', label: 'Foot and ankle function, daily living (0–100)', unit: 'percent', min: 0, max: 100, higherIsBetter: true, mcid: 8, mcidSource: 'Martin 2005', retired: false },
  { id: 6, code: 'groc', label: 'Global rating of change (−7 to +7)', unit: 'points', min: -7, max: 7, higherIsBetter: true, mcid: null, mcidSource: 'anchor', retired: false },
];

export const interventions = [
  { id: 1, code: 'education-load', label: 'Education and load management', kind: 'core', graded: false },
  { id: 3, code: 'heel-raises', label: 'Graded heel raises', kind: 'core', graded: true },
  { id: 4, code: 'toe-flexor', label: 'Toe flexor strengthening', kind: 'addon', graded: false },
];

export const SALT = '5d0c3a91b7e24f68a1c9e07b3d5f2a48';
export const salt = { clinicId: 3, salt: SALT, iterations: 310_000, algorithm: 'PBKDF2-HMAC-SHA-256 (310,000 iterations) → HMAC-SHA-256, hex' };

export const listItem = (n: number, over: Record<string, unknown> = {}) => ({
  id: n,
  clinicId: 3,
  reference: `HB-${String(n).padStart(4, '0')}`,
  startDate: '2026-02-02',
  status: 'open',
  weeksInCare: 9,
  activityProfile: 'runner',
  lastAssessedOn: '2026-03-16',
  latestFirstStepPain: 4,
  firstStepPainChange: -3,
  version: 1,
  ...over,
});

const assessment = (id: number, timepoint: string, assessedOn: string, days: number, scores: Record<string, number>) => ({
  id, assessedOn, timepoint, reporter: 'clinician', daysSinceStart: days, avgDailySteps: null, adverseEvent: null, scores,
});

export const episodeDetail = (over: Record<string, unknown> = {}) => ({
  id: 12,
  clinicId: 3,
  pseudonym: 'ab12cd34'.padEnd(64, '0'),
  reference: 'HB-0012',
  conditionCode: 'plantar-heel-pain',
  side: 'left',
  startDate: '2026-01-05',
  symptomWeeks: 20,
  ageYears: 51,
  sex: 'female',
  heightCm: 165,
  weightKg: 72,
  activityProfile: 'active',
  standingWork: true,
  researchConsent: true,
  status: 'open',
  dischargeDate: null,
  dischargeReason: null,
  version: 3,
  createdAt: '2026-01-05T10:00:00.000Z',
  updatedAt: '2026-01-05T10:00:00.000Z',
  bmi: 26.4,
  bmiBand: 'overweight',
  assessments: [assessment(100, 'baseline', '2026-01-05', 0, { 'nprs-first-step': 7, 'faam-adl': 55 })],
  interventions: [{ code: 'education-load', label: 'Education and load management', kind: 'core', graded: false, startWeek: 0, maxLevel: null }],
  ...over,
});

export { assessment };
