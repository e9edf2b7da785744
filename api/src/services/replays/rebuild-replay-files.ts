import { randomUUID } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import type { TReplayOverrides } from '../../../../shared/engine/settings';
import { AppError } from '../../../../shared/errors';
import { replayDir } from '../../replays/replay-files';
import type { ReplayPool } from '../../replays/replay-pool';

/** Files of a finished replay under derived/ (see replay-files.ts); result.json last. */
export const REPLAY_DERIVED_FILES = [
  'keyframes.bin',
  'disagreement.bin',
  'series.json',
  'safety.json',
  'causes.json',
  'result.json',
] as const;

export interface ReplayToRebuild {
  id: string;
  /** The stored original the replay read. */
  bundlePath: string;
  overrides: TReplayOverrides;
  /** The digest recorded when the replay first finished. */
  digest: string | null;
}

const exists = (file: string) =>
  fs.promises.stat(file).then(
    (stat) => stat.isFile(),
    () => false,
  );

/**
 * derived/ holds copies that can always be made again from the originals (README, "Data"), so a
 * missing result file is rebuilt by re-running the replay, which is deterministic: the rebuilt
 * digest must equal the recorded one, or nothing is replaced and the caller is told. Concurrent
 * requests for one replay share one re-run.
 */
export function createReplayRebuilder(deps: {
  derivedDir: string;
  pool: ReplayPool;
  maxUnpackedBytes: number;
}) {
  const running = new Map<string, Promise<void>>();

  async function rebuild(replay: ReplayToRebuild, dir: string): Promise<void> {
    const temp = `${dir}.rebuild-${randomUUID()}`;
    try {
      const result = await deps.pool.run(
        {
          bundlePath: replay.bundlePath,
          overrides: replay.overrides,
          outDir: temp,
          maxUnpackedBytes: deps.maxUnpackedBytes,
        },
        new AbortController().signal,
        () => {},
      );
      if (replay.digest && result.digest !== replay.digest) {
        throw new AppError(
          'internal',
          `The result files of replay ${replay.id} are missing and re-running it gave digest ${result.digest}, not the recorded ${replay.digest}; nothing was replaced. Start the replay again to get new results.`,
        );
      }
      await fs.promises.mkdir(dir, { recursive: true });
      for (const name of REPLAY_DERIVED_FILES) {
        await fs.promises.rename(path.join(temp, name), path.join(dir, name));
      }
    } catch (error) {
      if (error instanceof AppError) throw error;
      throw new AppError(
        'internal',
        `The result files of replay ${replay.id} are missing and could not be rebuilt from the original bundle: ${(error as Error).message}`,
        undefined,
        { cause: error },
      );
    } finally {
      await fs.promises.rm(temp, { recursive: true, force: true });
    }
  }

  /** Returns the replay's folder once every result file is present, rebuilding them if any is not. */
  async function ensureFiles(replay: ReplayToRebuild): Promise<string> {
    const dir = replayDir(deps.derivedDir, replay.id);
    const present = await Promise.all(REPLAY_DERIVED_FILES.map((name) => exists(path.join(dir, name))));
    if (present.every(Boolean)) return dir;
    let pending = running.get(replay.id);
    if (!pending) {
      pending = rebuild(replay, dir).finally(() => running.delete(replay.id));
      running.set(replay.id, pending);
    }
    await pending;
    return dir;
  }

  return { ensureFiles };
}
