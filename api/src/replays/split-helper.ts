import { type SplitBuffers, serveSplit } from '../../../shared/engine/particle-split';
import { buildReplayContext } from '../../../shared/engine/replay-context';
import type { ReplaySettings } from '../../../shared/engine/settings';
import type { BundleSource } from '../bundles/inspect-bundle';
import { inspectBundle } from '../bundles/inspect-bundle';

/** What a helper thread needs: the same bundle and settings as the coordinator, and the shared buffers. */
export interface SplitHelperTask {
  kind: 'split-helper';
  source: BundleSource;
  settings: ReplaySettings;
  buffers: SplitBuffers;
  maxUnpackedBytes?: number;
}

/**
 * Helper side of a split replay (shared/engine/particle-split.ts): reads the bundle, builds its
 * own copy of the read-only context and runs chunks until the coordinator finishes. A helper
 * that cannot read the bundle just returns: the coordinator never waits for it.
 */
export async function runSplitHelper(task: SplitHelperTask): Promise<void> {
  const inspection = await inspectBundle(
    task.source,
    task.maxUnpackedBytes ? { maxTotalBytes: task.maxUnpackedBytes } : {},
  );
  if (!inspection.ok || !inspection.bundle) return;
  serveSplit(buildReplayContext(inspection.bundle, task.settings), task.buffers);
}
