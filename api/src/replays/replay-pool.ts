import { EventEmitter } from 'node:events';
import path from 'node:path';
import { MessageChannel } from 'node:worker_threads';
import { Piscina } from 'piscina';
import { createSplitBuffers, finishSplit, type SplitBuffers } from '../../../shared/engine/particle-split';
import {
  particleCapacity,
  type ReplaySettings,
  type TReplayOverrides,
} from '../../../shared/engine/settings';
import type { ReplayResultFile } from './replay-files';
import type { SplitHelperTask } from './split-helper';
import { defaultReplayThreads } from './split-threads';

const WORKER_FILE = path.join(import.meta.dirname, `replay-worker${path.extname(import.meta.filename)}`);

export type ReplayEvent =
  | { type: 'started'; settings: ReplaySettings }
  | { type: 'progress'; step: number; steps: number };

export interface ReplayJob {
  bundlePath: string;
  overrides: TReplayOverrides;
  /** The settings the overrides resolve to (sizes the shared particle arrays of a split). */
  settings?: ReplaySettings;
  outDir: string;
  maxUnpackedBytes?: number;
}

/**
 * Worker threads for replays, off the HTTP thread. One replay's particles are split across the
 * pool's threads (shared/engine/particle-split.ts): its worker coordinates and `maxThreads - 1`
 * helper tasks join it as pool threads come free, so a lone replay uses every thread and two
 * replays share them; the digest is the single-thread one either way. Cancelling aborts the
 * tasks, which ends their workers, and releases the helpers.
 */
export function createReplayPool(options: { maxThreads?: number } = {}) {
  const maxThreads = options.maxThreads ?? defaultReplayThreads();
  const pool = new Piscina({
    filename: WORKER_FILE,
    minThreads: 0,
    maxThreads,
    idleTimeout: 30_000,
    // Source runs (tsx) need the TypeScript loader inside each worker too.
    execArgv: WORKER_FILE.endsWith('.ts')
      ? [...process.execArgv.filter((a) => a !== '--test'), '--import', 'tsx']
      : [],
  });

  function run(
    job: ReplayJob,
    signal: AbortSignal,
    onEvent: (event: ReplayEvent) => void,
  ): Promise<ReplayResultFile> {
    const channel = new MessageChannel();
    channel.port2.on('message', onEvent);
    const split: SplitBuffers | undefined =
      maxThreads > 1 && job.settings ? createSplitBuffers(particleCapacity(job.settings)) : undefined;
    const task = { ...job, split, port: channel.port1 };
    const coordinator = pool.run(task, {
      transferList: [channel.port1],
      signal,
    }) as Promise<ReplayResultFile>;
    if (split && job.settings) {
      const helper: SplitHelperTask = {
        kind: 'split-helper',
        source: { kind: 'zip', path: job.bundlePath },
        settings: job.settings,
        buffers: split,
        maxUnpackedBytes: job.maxUnpackedBytes,
      };
      // A helper only speeds the replay up: its failure or cancellation never fails the replay.
      for (let i = 1; i < maxThreads; i++) pool.run(helper, { signal }).catch(() => {});
    }
    return coordinator.finally(() => {
      if (split) finishSplit(split);
      channel.port2.close();
    });
  }

  return { run, close: () => pool.destroy(), events: new EventEmitter(), threads: maxThreads };
}

export type ReplayPool = ReturnType<typeof createReplayPool>;
