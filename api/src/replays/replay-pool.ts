import { EventEmitter } from 'node:events';
import path from 'node:path';
import { MessageChannel } from 'node:worker_threads';
import { Piscina } from 'piscina';
import type { ReplaySettings, TReplayOverrides } from '../../../shared/engine/settings';
import type { ReplayResultFile } from './replay-files';

const WORKER_FILE = path.join(import.meta.dirname, `replay-worker${path.extname(import.meta.filename)}`);

export type ReplayEvent =
  | { type: 'started'; settings: ReplaySettings }
  | { type: 'progress'; step: number; steps: number };

export interface ReplayJob {
  bundlePath: string;
  overrides: TReplayOverrides;
  outDir: string;
  maxUnpackedBytes?: number;
}

/**
 * Worker threads for replays. Each replay runs whole in one worker (the engine is single
 * threaded and deterministic); with 2 threads two replays run at once and the HTTP thread stays
 * free. Cancelling aborts the task, which ends its worker.
 */
export function createReplayPool(options: { maxThreads?: number } = {}) {
  const pool = new Piscina({
    filename: WORKER_FILE,
    minThreads: 0,
    maxThreads: options.maxThreads ?? 2,
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
    const task = { ...job, port: channel.port1 };
    return pool
      .run(task, { transferList: [channel.port1], signal })
      .finally(() => channel.port2.close()) as Promise<ReplayResultFile>;
  }

  return { run, close: () => pool.destroy(), events: new EventEmitter() };
}

export type ReplayPool = ReturnType<typeof createReplayPool>;
