/** The one query-key factory: general to specific, never an inline key array. */
export const queryKeys = {
  health: () => ['health'] as const,
};
