import { queryOptions, useQuery } from '@tanstack/react-query';
import { caseWorkKey } from '@web/components/case-work-query-key';
import { apiPaths } from '@web/config/paths';
import { apiRequest, isApiError } from '@web/lib/api-client';
import { z } from 'zod';

// Bookmarks and saved queries come from the workspace; their exact shape may still grow, so only
// the fields a picker needs are read.
const ZSource = z.looseObject({
  id: z.string(),
  label: z.string().optional(),
  name: z.string().optional(),
  title: z.string().optional(),
  note: z.string().optional(),
  t: z.number().optional(),
  replayLabel: z.string().optional(),
  resultSha256: z.string().optional(),
});
const ZSourceList = z.object({ items: z.array(ZSource) });
export type EvidenceSource = z.infer<typeof ZSource>;

/** `null` when this server does not offer the list (404), so the form asks for an id instead. */
async function getOptionalList(path: string, signal?: AbortSignal): Promise<EvidenceSource[] | null> {
  try {
    return (await apiRequest(path, { schema: ZSourceList, signal })).items;
  } catch (error) {
    if (isApiError(error) && (error.status === 404 || error.status === 405)) return null;
    throw error;
  }
}

export function evidenceSourcesQueryOptions(caseId: string) {
  return queryOptions({
    queryKey: [...caseWorkKey(caseId), 'evidence-sources'] as const,
    queryFn: async ({ signal }) => {
      const [bookmarks, queries] = await Promise.all([
        getOptionalList(apiPaths.caseBookmarks(caseId), signal),
        getOptionalList(apiPaths.caseQueries(caseId), signal),
      ]);
      return { bookmarks, queries };
    },
  });
}

export function useEvidenceSources(caseId: string) {
  return useQuery(evidenceSourcesQueryOptions(caseId));
}

/** A bookmark by its note, moment and replay; a saved query by its title; never a bare id if a name exists. */
export function sourceLabel(source: EvidenceSource): string {
  if (source.t !== undefined) {
    const moment = `${source.t.toFixed(1)} s${source.replayLabel ? `, ${source.replayLabel}` : ''}`;
    return source.note?.trim() ? `${source.note.trim()} (${moment})` : `Moment at ${moment}`;
  }
  return source.label ?? source.name ?? source.title ?? source.id;
}
