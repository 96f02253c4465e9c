import { useCallback, useMemo } from 'react';
import { useSearchParams } from 'react-router-dom';
import { ANALYTICS_FILTER_KEYS, type AnalyticsFilterParams } from '../../../shared/schemas/analytics-filters';

type FilterKey = (typeof ANALYTICS_FILTER_KEYS)[number];

/** The analytics filters found in a URL's search params, in canonical key order (unknown keys ignored). */
export function readFilterParams(search: URLSearchParams): AnalyticsFilterParams {
  const out: AnalyticsFilterParams = {};
  for (const key of ANALYTICS_FILTER_KEYS) {
    const v = search.get(key);
    if (v !== null && v !== '') out[key] = v;
  }
  return out;
}

/** `?from=…&instrument=…` for an API call: only the filters, in canonical order. */
export function filterQueryString(f: AnalyticsFilterParams, only?: readonly FilterKey[]): string {
  const q = new URLSearchParams();
  for (const key of ANALYTICS_FILTER_KEYS) {
    const v = f[key];
    if (v && (!only || only.includes(key))) q.set(key, v);
  }
  const s = q.toString();
  return s ? `?${s}` : '';
}

/**
 * The dashboards' shared filter state, kept in the URL so a view can be bookmarked and shared.
 * `set` changes some keys (undefined or '' removes one) and keeps every other search param.
 */
export function useFilterParams() {
  const [search, setSearch] = useSearchParams();
  const filters = useMemo(() => readFilterParams(search), [search]);
  const set = useCallback(
    (changes: Partial<Record<FilterKey | 'measure' | 'chartInstrument', string | undefined>>) => {
      setSearch(
        (prev) => {
          const next = new URLSearchParams(prev);
          for (const [k, v] of Object.entries(changes)) {
            if (v === undefined || v === '') next.delete(k);
            else next.set(k, v);
          }
          return next;
        },
        { replace: false },
      );
    },
    [setSearch],
  );
  return { filters, search, set };
}

/** Every analytics filter removed: what "Clear the filters" sends to `set`. */
export const NO_FILTERS: Partial<Record<FilterKey, undefined>> = Object.fromEntries(
  ANALYTICS_FILTER_KEYS.map((k) => [k, undefined]),
);
