import type { AuditQuery, PeopleQuery } from '../../shared/schemas/admin';
import type { EpisodeListQuery } from '../../shared/schemas/episode';
import type { AnalyticsFilterParams } from '../../shared/schemas/analytics-filters';
import type { CohortCriteriaInput } from '../../shared/schemas/cohort';

/** The one query-key factory: general to specific, never an inline key array. */
export const queryKeys = {
  health: () => ['health'] as const,
  auth: {
    me: () => ['auth', 'me'] as const,
    accounts: () => ['auth', 'accounts'] as const,
    outbox: () => ['auth', 'outbox'] as const,
  },
  episodes: {
    all: () => ['episodes'] as const,
    lists: () => ['episodes', 'list'] as const,
    list: (filters: EpisodeListQuery) => ['episodes', 'list', filters] as const,
    detail: (id: number) => ['episodes', 'detail', id] as const,
  },
  reference: {
    instruments: () => ['reference', 'instruments'] as const,
    interventions: () => ['reference', 'interventions'] as const,
  },
  uploads: {
    all: () => ['uploads'] as const,
    list: (page: { limit: number; offset: number }) => ['uploads', 'list', page] as const,
  },
  pseudonymSalt: () => ['clinics', 'current', 'pseudonym-salt'] as const,
  followUps: {
    all: () => ['follow-ups'] as const,
    lists: () => ['follow-ups', 'list'] as const,
    list: (filters: { state: string; sort: string; order: string; limit: number; offset: number }) =>
      ['follow-ups', 'list', filters] as const,
    completeness: () => ['follow-ups', 'completeness'] as const,
    lostProposals: () => ['follow-ups', 'lost-proposals'] as const,
  },
  preferences: () => ['me', 'preferences'] as const,
  selfReport: {
    form: (token: string) => ['self-report', token] as const,
  },
  /** The steward's console (and the lead's part of it). */
  admin: {
    all: () => ['admin'] as const,
    clinics: () => ['admin', 'clinics'] as const,
    people: () => ['admin', 'people'] as const,
    peopleList: (q: PeopleQuery) => ['admin', 'people', q] as const,
    instruments: () => ['admin', 'instruments'] as const,
    codes: () => ['admin', 'codes'] as const,
    proposals: () => ['admin', 'proposals'] as const,
    rules: () => ['admin', 'rules'] as const,
    audit: () => ['admin', 'audit'] as const,
    auditList: (q: AuditQuery) => ['admin', 'audit', 'list', q] as const,
    auditFacets: () => ['admin', 'audit', 'facets'] as const,
  },
  /** The rules in force, for every signed-in screen that shows numbers. */
  rules: {
    current: () => ['rules', 'current'] as const,
  },
  /** Outcome dashboards: one key per endpoint and filter set (filters in canonical form). */
  analytics: {
    all: () => ['analytics'] as const,
    outcomes: (f: AnalyticsFilterParams) => ['analytics', 'outcomes', f] as const,
    recovery: (f: AnalyticsFilterParams) => ['analytics', 'recovery', f] as const,
    addons: (f: AnalyticsFilterParams) => ['analytics', 'addons', f] as const,
    clinics: (f: AnalyticsFilterParams) => ['analytics', 'clinics', f] as const,
    trajectory: (episodeId: number, f: AnalyticsFilterParams) => ['analytics', 'trajectory', episodeId, f] as const,
  },
  /** Research cohorts: saved definitions and the builder's live preview. */
  cohorts: {
    all: () => ['cohorts'] as const,
    list: () => ['cohorts', 'list'] as const,
    detail: (id: number) => ['cohorts', 'detail', id] as const,
    preview: (criteria: CohortCriteriaInput) => ['cohorts', 'preview', criteria] as const,
  },
  /** Data requests, their decisions and the steward's exports log. */
  dataRequests: {
    all: () => ['data-requests'] as const,
    list: () => ['data-requests', 'list'] as const,
    exports: () => ['data-requests', 'exports-log'] as const,
  },
};
