import type { MessagePort } from 'node:worker_threads';
import type { TReplayFlag } from '../../../shared/contracts/replays';
import { replayBundle } from '../../../shared/engine';
import { findProbableCauses } from '../../../shared/engine/causes/find-probable-causes';
import { adoptSplit, finishSplit, type SplitBuffers } from '../../../shared/engine/particle-split';
import { buildReplayContext } from '../../../shared/engine/replay-context';
import type { TReplayOverrides } from '../../../shared/engine/settings';
import { createSafetyObserver } from '../../../shared/safety/safety-observer';
import { analyseReplay } from './analyse-replay';
import { loadBundleForReplay, settingsFor } from './replay-bundle-file';
import { type ReplayResultFile, writeReplayFiles } from './replay-files';
import { nodeEngineStamp } from './runtime';
import { runSplitHelper, type SplitHelperTask } from './split-helper';

export interface ReplayTask {
  bundlePath: string;
  overrides: TReplayOverrides;
  outDir: string;
  maxUnpackedBytes?: number;
  /** Shared particle arrays when pool threads help with this replay (see particle-split.ts). */
  split?: SplitBuffers;
  /** Receives `{ type: 'progress', step, steps }` and `{ type: 'started', settings }`. */
  port: MessagePort;
}

/**
 * Keyframe spacing for API replays: any step is at most 24 steps of re-simulation away, which keeps
 * `GET /api/replays/:id/steps/:k` fast (about 8 MB per 6,000-step, 2,000-particle replay).
 */
const KEYFRAME_INTERVAL = 25;

/** How often progress is reported, as a fraction of the run. */
const PROGRESS_FRACTION = 0.01;

/**
 * Runs one replay in a worker thread: loads the stored bundle, replays it, detects flags and
 * writes the result files. The main thread stays free to answer requests meanwhile.
 */
export default async function runPoolTask(
  task: ReplayTask | SplitHelperTask,
): Promise<ReplayResultFile | undefined> {
  if ('kind' in task && task.kind === 'split-helper') {
    await runSplitHelper(task);
    return undefined;
  }
  return runReplayTask(task as ReplayTask);
}

async function runReplayTask(task: ReplayTask): Promise<ReplayResultFile> {
  try {
    const bundle = await loadBundleForReplay(task.bundlePath, task.maxUnpackedBytes);
    const settings = settingsFor(bundle, task.overrides);
    task.port.postMessage({ type: 'started', settings });
    const startedAt = performance.now();
    let nextReport = 0;
    const context = buildReplayContext(bundle, settings);
    const split = task.split;
    // The shared arrays were sized from the service's settings; use them only if they fit these.
    const canSplit = split !== undefined && split.arrays[0].byteLength >= 8 * context.capacity;
    const safety = createSafetyObserver(bundle);
    const result = replayBundle(
      bundle,
      {},
      {
        settings,
        context,
        adopt: canSplit ? adoptSplit(context, split) : undefined,
        keyframeInterval: KEYFRAME_INTERVAL,
        onStepState: safety.onStepState,
        onStep: ({ step, steps }) => {
          if (step >= nextReport || step === steps - 1) {
            task.port.postMessage({ type: 'progress', step: step + 1, steps });
            nextReport = step + Math.max(1, Math.floor(steps * PROGRESS_FRACTION));
          }
          return true;
        },
      },
    );
    const elapsedMs = performance.now() - startedAt;
    const analysis: { flags: TReplayFlag[]; divergedAt: number | null } = analyseReplay(
      bundle,
      result,
      context,
    );
    // After the replay and from its results only, so the causes cannot change its digest.
    const causes = findProbableCauses({ ...result, bundle, context, flags: analysis.flags });
    return writeReplayFiles(task.outDir, result, {
      elapsedMs,
      ...analysis,
      causes,
      safety: safety.finish(result.series),
      engine: nodeEngineStamp(),
    });
  } finally {
    if (task.split) finishSplit(task.split);
    task.port.close();
  }
}
