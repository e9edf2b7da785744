import { availableParallelism } from 'node:os';
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import { Worker } from 'node:worker_threads';
import type { ReplayOptions } from '../../../shared/engine/filter';
import {
  adoptSplit,
  createSplitBuffers,
  finishSplit,
  type SplitBuffers,
} from '../../../shared/engine/particle-split';
import type { BundleSource } from '../bundles/inspect-bundle';
import type { SplitHelperTask } from './split-helper';

const HELPER_MODULE = path.join(import.meta.dirname, `split-helper${path.extname(import.meta.filename)}`);

/** Threads a replay may use by default: every core. */
export const defaultReplayThreads = () => Math.max(1, availableParallelism());

/**
 * A replay split over `threads` threads of this process (this one plus `threads - 1` worker
 * threads): `adopt` goes into the replay options; `close()` releases and ends the helpers
 * whether the replay finished, failed or was cancelled.
 */
export function createThreadSplit(
  threads: number,
  source: BundleSource,
  maxUnpackedBytes?: number,
): { adopt: NonNullable<ReplayOptions['adopt']>; close(): Promise<void> } {
  const workers: Worker[] = [];
  let buffers: SplitBuffers | undefined;
  return {
    adopt(state, workspace, context) {
      buffers = createSplitBuffers(context.capacity);
      const task: SplitHelperTask = {
        kind: 'split-helper',
        source,
        settings: context.settings,
        buffers,
        maxUnpackedBytes,
      };
      // Source runs (tsx) load the TypeScript helper through tsx's loader; built runs import it.
      const url = JSON.stringify(pathToFileURL(HELPER_MODULE).href);
      const entry = HELPER_MODULE.endsWith('.ts')
        ? `import('tsx/esm/api').then((tsx) => { tsx.register(); return import(${url}); })`
        : `import(${url})`;
      for (let i = 1; i < threads; i++) {
        const worker = new Worker(
          `const { workerData } = require('node:worker_threads');
           ${entry}.then((m) => m.runSplitHelper(workerData));`,
          { eval: true, workerData: task },
        );
        // The coordinator never waits for a helper, so a helper that fails only costs speed.
        worker.on('error', () => {});
        workers.push(worker);
      }
      adoptSplit(context, buffers)(state, workspace);
    },
    async close() {
      if (buffers) finishSplit(buffers);
      await Promise.all(workers.map((worker) => worker.terminate()));
    },
  };
}
