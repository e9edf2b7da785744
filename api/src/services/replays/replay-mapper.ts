import type { TReplay, TReplayFlag } from '../../../../shared/contracts/replays';
import type { ReplayRow } from '../../db/schema';

export function toReplay(
  row: ReplayRow,
  extra: { caseId: string; authorName: string; progress: TReplay['progress'] },
): TReplay {
  return {
    id: row.id,
    bundleId: row.bundleId,
    caseId: extra.caseId,
    label: row.label,
    status: row.status,
    overrides: row.overrides as TReplay['overrides'],
    settings: (row.settings as TReplay['settings']) ?? null,
    digest: row.digest,
    engine: (row.engine as TReplay['engine']) ?? null,
    steps: row.steps,
    elapsedMs: row.elapsedMs,
    metrics: (row.metrics as TReplay['metrics']) ?? null,
    flags: (row.flags as TReplayFlag[] | null) ?? [],
    error: row.error,
    progress: extra.progress,
    createdBy: { id: row.createdBy, name: extra.authorName },
    createdAt: row.createdAt.toISOString(),
    finishedAt: row.finishedAt?.toISOString() ?? null,
  };
}
