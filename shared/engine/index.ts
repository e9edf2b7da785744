/**
 * The replay engine's public entry: `replayFromFiles(files, overrides?)` replays a bundle given
 * as file name → contents (text or UTF-8 bytes) with the manifest's filter settings plus what-if
 * overrides, exactly as the CLI, the API's workers and the browser's re-run do. `replayBundle` is
 * the same after reading, for callers that already hold a bundle read by the streaming reader.
 * Results carry the engine version and digest layout (see engine-version.ts).
 */
import { formatIssue } from '../bundle/format-issue';
import type { Bundle } from '../bundle/types';
import { validateBundleFiles } from '../bundle/validate-bundle-files';
import { DIGEST_LAYOUT, ENGINE_VERSION } from './engine-version';
import { type ReplayOptions, type ReplayResult, runReplay } from './filter';
import { buildReplayContext, type ReplayContext } from './replay-context';
import { parseReplayOverrides, type ReplaySettings, resolveReplaySettings } from './settings';

export { DIGEST_LAYOUT, ENGINE_VERSION, type EngineStamp, engineStamp } from './engine-version';
export { ReplayCancelledError, type ReplayOptions, type ReplayResult } from './filter';
export type { ReplaySettings, TReplayOverrides } from './settings';

/** Bundle file name (as in the bundle format, e.g. "scans.ndjson") → its text or its bytes. */
export type BundleFiles = Record<string, string | Uint8Array>;

/** The inputs cannot be replayed: each problem in plain words, with file, line or field. */
export class ReplayInputError extends Error {
  constructor(readonly problems: string[]) {
    super(problems.length === 1 ? problems[0] : `${problems.length} problems: ${problems.join('; ')}`);
    this.name = 'ReplayInputError';
  }
}

export interface ReplayFromFilesOptions extends ReplayOptions {
  /** Replay with exactly these settings (e.g. recorded ones) instead of manifest + overrides. */
  settings?: ReplaySettings;
}

export interface EngineReplay extends ReplayResult {
  engine: { version: string; digestLayout: number };
  bundle: Bundle;
  context: ReplayContext;
}

/** Reads and validates bundle files; throws ReplayInputError listing the problems (warnings pass). */
export function readBundleFiles(files: BundleFiles): Bundle {
  const texts: Record<string, string> = {};
  const decoder = new TextDecoder('utf-8', { fatal: true });
  const problems: string[] = [];
  for (const [name, contents] of Object.entries(files)) {
    if (typeof contents === 'string') texts[name] = contents;
    else {
      try {
        texts[name] = decoder.decode(contents);
      } catch {
        problems.push(`${name}: not UTF-8 text`);
      }
    }
  }
  if (problems.length > 0) throw new ReplayInputError(problems);
  const read = validateBundleFiles(texts);
  if (!read.ok || !read.bundle) {
    const errors = read.issues.filter((issue) => issue.severity !== 'warning');
    throw new ReplayInputError((errors.length > 0 ? errors : read.issues).map(formatIssue));
  }
  return read.bundle;
}

/** Replays an already read bundle: manifest filter block + validated overrides (or `options.settings`). */
export function replayBundle(
  bundle: Bundle,
  overrides: unknown = {},
  options: ReplayFromFilesOptions = {},
): EngineReplay {
  let settings = options.settings;
  if (!settings) {
    const parsed = parseReplayOverrides(overrides);
    if (!parsed.ok) throw new ReplayInputError(parsed.issues.map((i) => `${i.field}: ${i.message}`));
    const resolved = resolveReplaySettings(bundle.manifest, parsed.overrides);
    if (!resolved.ok) throw new ReplayInputError(resolved.issues.map((i) => `${i.field}: ${i.message}`));
    settings = resolved.settings;
  }
  const context = options.context ?? buildReplayContext(bundle, settings);
  const result = runReplay(bundle, settings, { ...options, context });
  return { ...result, engine: { version: ENGINE_VERSION, digestLayout: DIGEST_LAYOUT }, bundle, context };
}

/** Replays a bundle given as files; see the file comment. Throws ReplayInputError for bad input. */
export function replayFromFiles(
  files: BundleFiles,
  overrides: unknown = {},
  options: ReplayFromFilesOptions = {},
): EngineReplay {
  return replayBundle(readBundleFiles(files), overrides, options);
}
