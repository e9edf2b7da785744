import type { MessagePort } from 'node:worker_threads';
import type { TReplayFlag } from '../../../shared/contracts/replays';
import { runReplay } from '../../../shared/engine/filter';
import { buildReplayContext } from '../../../shared/engine/replay-context';
import type { TReplayOverrides } from '../../../shared/engine/settings';
import { analyseReplay } from './analyse-replay';
import { loadBundleForReplay, settingsFor } from './replay-bundle-file';
import { type ReplayResultFile, writeReplayFiles } from './replay-files';

export interface ReplayTask {
  bundlePath: string;
  overrides: TReplayOverrides;
  outDir: string;
  maxUnpackedBytes?: number;
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
export default async function runReplayTask(task: ReplayTask): Promise<ReplayResultFile> {
  try {
    const bundle = await loadBundleForReplay(task.bundlePath, task.maxUnpackedBytes);
    const settings = settingsFor(bundle, task.overrides);
    task.port.postMessage({ type: 'started', settings });
    const startedAt = performance.now();
    let nextReport = 0;
    const context = buildReplayContext(bundle, settings);
    const result = runReplay(bundle, settings, {
      context,
      keyframeInterval: KEYFRAME_INTERVAL,
      onStep: ({ step, steps }) => {
        if (step >= nextReport || step === steps - 1) {
          task.port.postMessage({ type: 'progress', step: step + 1, steps });
          nextReport = step + Math.max(1, Math.floor(steps * PROGRESS_FRACTION));
        }
        return true;
      },
    });
    const elapsedMs = performance.now() - startedAt;
    const analysis: { flags: TReplayFlag[]; divergedAt: number | null } = analyseReplay(
      bundle,
      result,
      context,
    );
    return writeReplayFiles(task.outDir, result, { elapsedMs, ...analysis });
  } finally {
    task.port.close();
  }
}
