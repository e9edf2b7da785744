import { type TBundleRecord, ZBundleList } from '@shared/contracts/bundles';
import { isReplayLive, type TReplay, ZReplayList } from '@shared/contracts/replays';
import { queryOptions } from '@tanstack/react-query';
import { apiPaths } from '../config/paths';
import { apiRequest } from '../lib/api-client';
import { caseWorkKey } from './case-work-query-key';

export interface CaseReplays {
  bundles: TBundleRecord[];
  /** Every replay of every bundle of the case, newest first. */
  replays: TReplay[];
}

/** The case's bundles and their replays: what findings cite and what a fix is verified with. */
export async function getCaseReplays(caseId: string, signal?: AbortSignal): Promise<CaseReplays> {
  const { items: bundles } = await apiRequest(apiPaths.caseBundles(caseId), { schema: ZBundleList, signal });
  const lists = await Promise.all(
    bundles.map((bundle) => apiRequest(apiPaths.bundleReplays(bundle.id), { schema: ZReplayList, signal })),
  );
  const replays = lists.flatMap((list) => list.items);
  replays.sort((a, b) => b.createdAt.localeCompare(a.createdAt));
  return { bundles, replays };
}

export function caseReplaysQueryOptions(caseId: string) {
  return queryOptions({
    queryKey: [...caseWorkKey(caseId), 'replays'] as const,
    queryFn: ({ signal }) => getCaseReplays(caseId, signal),
    // Replays run for seconds to minutes; poll while one is still going.
    refetchInterval: (query) =>
      query.state.data?.replays.some((r) => isReplayLive(r.status)) ? 2000 : false,
  });
}

/** A short label for a replay in pickers: label, bundle file and digest prefix. */
export function describeReplay(replay: TReplay, bundles: TBundleRecord[]): string {
  const bundle = bundles.find((b) => b.id === replay.bundleId);
  const digest = replay.digest ? ` · digest ${replay.digest.slice(0, 12)}…` : '';
  return `${replay.label || 'Replay'} (${bundle?.originalName ?? 'bundle'})${digest}`;
}
