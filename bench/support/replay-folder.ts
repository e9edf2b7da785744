/**
 * Replays a bundle folder (plain files, as in sample-logs/) with its manifest's settings and
 * optional overrides, and runs the flag detectors: the shared step of the flag benchmarks.
 */
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import type { Bundle } from '../../shared/bundle/types';
import { validateBundleFiles } from '../../shared/bundle/validate-bundle-files';
import { runReplay } from '../../shared/engine/filter';
import { detectFlags } from '../../shared/engine/flags/detect-flags';
import type { ReplayFlag } from '../../shared/engine/flags/flag-types';
import { buildReplayContext, type ReplayContext } from '../../shared/engine/replay-context';
import type { ReplaySeries } from '../../shared/engine/replay-series';
import {
  type ReplaySettings,
  resolveReplaySettings,
  type TReplayOverrides,
} from '../../shared/engine/settings';

export interface FolderReplay {
  bundle: Bundle;
  settings: ReplaySettings;
  context: ReplayContext;
  series: ReplaySeries;
  neesBound: number;
  rmse: number | null;
  replayMs: number;
}

export function readBundleFolder(folder: string): Bundle {
  const files: Record<string, string> = {};
  for (const name of readdirSync(folder)) files[name] = readFileSync(join(folder, name), 'utf8');
  const read = validateBundleFiles(files);
  if (!read.ok || !read.bundle)
    throw new Error(`${folder} does not read: ${JSON.stringify(read.issues.slice(0, 3))}`);
  return read.bundle;
}

export function replayFolder(folder: string, overrides: TReplayOverrides = {}): FolderReplay {
  const bundle = readBundleFolder(folder);
  const resolved = resolveReplaySettings(bundle.manifest, overrides);
  if (!resolved.ok) throw new Error(`${folder} settings: ${JSON.stringify(resolved.issues)}`);
  const context = buildReplayContext(bundle, resolved.settings);
  const started = performance.now();
  const result = runReplay(bundle, resolved.settings, { context, keyframeInterval: 0 });
  return {
    bundle,
    settings: resolved.settings,
    context,
    series: result.series,
    neesBound: result.neesBound,
    rmse: result.metrics.rmse_reference,
    replayMs: performance.now() - started,
  };
}

export function flagsOf(replay: FolderReplay): ReplayFlag[] {
  return detectFlags({
    bundle: replay.bundle,
    series: replay.series,
    settings: replay.settings,
    neesBound: replay.neesBound,
    context: replay.context,
  });
}
