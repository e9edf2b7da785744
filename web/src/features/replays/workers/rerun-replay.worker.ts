/// <reference lib="webworker" />
/**
 * Re-runs a replay in the browser, off the page's thread, with the same engine as the server:
 * unzip the original bundle, replayFromFiles, report progress and the digest.
 */
import { DIGEST_LAYOUT, ENGINE_VERSION, type ReplaySettings, replayFromFiles } from '@shared/engine';
import type { RerunMessage, RerunRequest } from '../lib/rerun-messages';
import { unzipBundle } from '../lib/unzip-bundle';

const post = (message: RerunMessage) => (self as unknown as DedicatedWorkerGlobalScope).postMessage(message);

self.onmessage = (event: MessageEvent<RerunRequest>) => {
  const { zip, settings, overrides } = event.data;
  try {
    const files = unzipBundle(new Uint8Array(zip));
    let nextReport = 0;
    const result = replayFromFiles(files, overrides, {
      settings: (settings as ReplaySettings | null) ?? undefined,
      keyframeInterval: 0,
      onStep: ({ step, steps }) => {
        if (step >= nextReport || step === steps - 1) {
          post({ type: 'progress', step: step + 1, steps });
          nextReport = step + Math.max(1, Math.floor(steps / 100));
        }
        return true;
      },
    });
    post({
      type: 'done',
      digest: result.digest,
      steps: result.steps,
      engine: ENGINE_VERSION,
      digestLayout: DIGEST_LAYOUT,
      runtime: navigator.userAgent,
    });
  } catch (error) {
    post({ type: 'error', message: error instanceof Error ? error.message : String(error) });
  }
};
