import fs from 'node:fs';
import path from 'node:path';
import type { TProbableCause, TReplayFlag } from '../../../shared/contracts/replays';
import type { ProbableCause } from '../../../shared/engine/causes/cause-types';
import type { EngineStamp } from '../../../shared/engine/engine-version';
import type { ReplayResult } from '../../../shared/engine/filter';
import type { Keyframe } from '../../../shared/engine/particle-state';
import type { ReplaySeries } from '../../../shared/engine/replay-series';
import type { ReplaySettings } from '../../../shared/engine/settings';
import type { SafetyReport } from '../../../shared/safety/safety-report';

/**
 * On-disk layout of one finished replay under `DATA_DIR/derived/replays/<id>/`:
 * - `result.json`: settings, digest, metrics, flags, keyframe index;
 * - `series.json`: one array per diagnostic (null for NaN), as served to the timeline;
 * - `keyframes.bin`: for each keyframe, float64 x[count], y[count], theta[count], logWeight[count];
 * - `disagreement.bin`: uint32 per map cell (row 0 northmost);
 * - `safety.json`: the separation and stopping analysis (shared/safety), absent for older replays;
 * - `causes.json`: the probable causes (shared/engine/causes), absent for older replays.
 * Files are written to a temporary name and renamed, so a crash never leaves a half result.
 */
export interface ReplayResultFile {
  settings: ReplaySettings;
  steps: number;
  digest: string;
  /** Engine version, digest layout and runtime that produced the digest; absent before engine 2.0.0 (layout 1). */
  engine?: EngineStamp;
  elapsedMs: number;
  metrics: ReplayResult['metrics'] & { diverged_at: number | null };
  flags: TReplayFlag[];
  neesBound: number;
  keyframeInterval: number;
  keyframes: { step: number; count: number; offset: number; logSlow: number; logFast: number }[];
}

export const replayDir = (derivedDir: string, replayId: string) => path.join(derivedDir, 'replays', replayId);

function writeAtomically(file: string, data: string | Uint8Array): void {
  const temp = `${file}.partial`;
  fs.writeFileSync(temp, data);
  fs.renameSync(temp, file);
}

/** JSON columns with NaN written as null (JSON has no NaN). */
export function seriesToColumns(series: ReplaySeries): Record<string, (number | null)[]> {
  const columns: Record<string, (number | null)[]> = {};
  for (const [name, values] of Object.entries(series) as [string, ArrayLike<number>][]) {
    const column = new Array<number | null>(values.length);
    for (let i = 0; i < values.length; i++) column[i] = Number.isFinite(values[i]) ? values[i] : null;
    columns[name] = column;
  }
  return columns;
}

export function writeReplayFiles(
  dir: string,
  result: ReplayResult,
  extra: {
    elapsedMs: number;
    flags: TReplayFlag[];
    divergedAt: number | null;
    engine: EngineStamp;
    safety?: SafetyReport;
    causes?: ProbableCause[];
  },
): ReplayResultFile {
  fs.mkdirSync(dir, { recursive: true });
  const keyframeIndex: ReplayResultFile['keyframes'] = [];
  const totalFloats = result.keyframes.reduce((sum, k) => sum + 4 * k.count, 0);
  const packed = new Float64Array(totalFloats);
  let offset = 0;
  for (const keyframe of result.keyframes) {
    keyframeIndex.push({
      step: keyframe.step,
      count: keyframe.count,
      offset,
      logSlow: keyframe.logSlow,
      logFast: keyframe.logFast,
    });
    for (const column of [keyframe.x, keyframe.y, keyframe.theta, keyframe.logWeight]) {
      packed.set(column.subarray(0, keyframe.count), offset);
      offset += keyframe.count;
    }
  }
  const file: ReplayResultFile = {
    settings: result.settings,
    steps: result.steps,
    digest: result.digest,
    engine: extra.engine,
    elapsedMs: extra.elapsedMs,
    metrics: { ...result.metrics, diverged_at: extra.divergedAt },
    flags: extra.flags,
    neesBound: result.neesBound,
    keyframeInterval: result.keyframeInterval,
    keyframes: keyframeIndex,
  };
  writeAtomically(path.join(dir, 'keyframes.bin'), new Uint8Array(packed.buffer));
  writeAtomically(path.join(dir, 'disagreement.bin'), new Uint8Array(result.disagreementCounts.buffer));
  writeAtomically(path.join(dir, 'series.json'), JSON.stringify(seriesToColumns(result.series)));
  if (extra.safety) writeAtomically(path.join(dir, 'safety.json'), JSON.stringify(extra.safety));
  if (extra.causes) writeAtomically(path.join(dir, 'causes.json'), JSON.stringify(extra.causes));
  // Written last: its presence marks a complete result.
  writeAtomically(path.join(dir, 'result.json'), JSON.stringify(file));
  return file;
}

export function readReplayResultFile(dir: string): ReplayResultFile {
  return JSON.parse(fs.readFileSync(path.join(dir, 'result.json'), 'utf8')) as ReplayResultFile;
}

export function readKeyframes(dir: string, index: ReplayResultFile['keyframes']): Keyframe[] {
  const bytes = fs.readFileSync(path.join(dir, 'keyframes.bin'));
  const floats = new Float64Array(bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + bytes.byteLength));
  return index.map((entry) => {
    const column = (i: number) =>
      floats.slice(entry.offset + i * entry.count, entry.offset + (i + 1) * entry.count);
    return {
      step: entry.step,
      count: entry.count,
      x: column(0),
      y: column(1),
      theta: column(2),
      logWeight: column(3),
      logSlow: entry.logSlow ?? Number.NEGATIVE_INFINITY,
      logFast: entry.logFast ?? Number.NEGATIVE_INFINITY,
    };
  });
}

export function readDisagreement(dir: string): Uint32Array {
  const bytes = fs.readFileSync(path.join(dir, 'disagreement.bin'));
  return new Uint32Array(bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + bytes.byteLength));
}

/** A derived JSON file of the replay, or null when it has none (made before the file existed). */
function readOptionalJson<T>(dir: string, name: string): T | null {
  try {
    return JSON.parse(fs.readFileSync(path.join(dir, name), 'utf8')) as T;
  } catch {
    return null;
  }
}

/** The replay's separation and stopping analysis, or null when it has none (made before it existed). */
export const readSafety = (dir: string) => readOptionalJson<SafetyReport>(dir, 'safety.json');

/** The replay's probable causes (NaN values were written as null), or null when it has none. */
export const readCauses = (dir: string) => readOptionalJson<TProbableCause[]>(dir, 'causes.json');
