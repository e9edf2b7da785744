/** Worker-thread side of tests/shared/engine/particle-split.test.ts: serves a synthetic replay's split. */
import { parentPort, workerData } from 'node:worker_threads';
import { type SplitBuffers, serveSplit } from '../../shared/engine/particle-split';
import { buildReplayContext } from '../../shared/engine/replay-context';
import type { ReplaySettings } from '../../shared/engine/settings';
import { makeSyntheticBundle, type SyntheticBundleOptions } from './engine-fixtures';

const { bundleOptions, settings, buffers } = workerData as {
  bundleOptions: SyntheticBundleOptions;
  settings: ReplaySettings;
  buffers: SplitBuffers;
};
const chunks = serveSplit(buildReplayContext(makeSyntheticBundle(bundleOptions), settings), buffers);
parentPort?.postMessage({ chunks });
