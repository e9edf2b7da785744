/**
 * Browser-side entry for the engine checks: bundled by esbuild into one script, added to a blank
 * page, and reached through `globalThis.driftcaseEngine`.
 */
import { DIGEST_LAYOUT, ENGINE_VERSION, replayFromFiles } from '../../../shared/engine';

const engine = {
  version: ENGINE_VERSION,
  digestLayout: DIGEST_LAYOUT,
  replayDigest(files: Record<string, string>, overrides: Record<string, unknown>): string {
    return replayFromFiles(files, overrides, { keyframeInterval: 0 }).digest;
  },
};

(globalThis as unknown as { driftcaseEngine: typeof engine }).driftcaseEngine = engine;
