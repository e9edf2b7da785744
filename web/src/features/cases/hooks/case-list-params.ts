import { type CASE_SORT_FIELDS, ZCaseListQuery } from '@shared/contracts/cases';
import type { CaseListQuery } from '../api/get-cases';

export type CaseSortField = (typeof CASE_SORT_FIELDS)[number];
export type CaseListParams = CaseListQuery;

const DEFAULTS = ZCaseListQuery.parse({});

/**
 * Reads the list state from the query string with the API's own schema. A hand-edited or stale value
 * (e.g. `?status=bogus`) falls back to its default instead of breaking the page.
 */
export function parseCaseListParams(search: URLSearchParams): CaseListParams {
  const raw: Record<string, string> = {};
  for (const key of Object.keys(ZCaseListQuery.shape)) {
    const value = search.get(key);
    if (value !== null && value !== '') raw[key] = value;
  }
  const whole = ZCaseListQuery.safeParse(raw);
  if (whole.success) return whole.data;
  const badKeys = new Set(whole.error.issues.map((issue) => String(issue.path[0])));
  const kept = Object.fromEntries(Object.entries(raw).filter(([key]) => !badKeys.has(key)));
  return ZCaseListQuery.safeParse(kept).data ?? DEFAULTS;
}

/** Writes only what differs from the defaults, so shared links stay short. */
export function serializeCaseListParams(params: CaseListParams): URLSearchParams {
  const search = new URLSearchParams();
  for (const [key, value] of Object.entries(params)) {
    if (value === undefined || value === '' || value === DEFAULTS[key as keyof typeof DEFAULTS]) continue;
    search.set(key, String(value));
  }
  return search;
}
