import { type TCaseList, ZCaseList, type ZCaseListQuery } from '@shared/contracts/cases';
import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { apiPaths } from '@web/config/paths';
import { apiRequest } from '@web/lib/api-client';
import type { z } from 'zod';

/** A fully resolved list query: every default filled in, as the URL state holds it. */
export type CaseListQuery = z.output<typeof ZCaseListQuery>;

/** Prefix of every case-list key, so a write can invalidate all filtered pages at once. */
export const caseListKeyPrefix = ['cases', 'list'] as const;

export function getCases(query: CaseListQuery, signal?: AbortSignal): Promise<TCaseList> {
  return apiRequest(apiPaths.cases, { query: { ...query }, schema: ZCaseList, signal });
}

export function casesQueryOptions(query: CaseListQuery) {
  return queryOptions({
    queryKey: [...caseListKeyPrefix, query] as const,
    queryFn: ({ signal }) => getCases(query, signal),
  });
}

/** Keeps the previous page on screen while the next one loads, so the table does not jump. */
export function useCases(query: CaseListQuery) {
  return useQuery({ ...casesQueryOptions(query), placeholderData: keepPreviousData });
}
