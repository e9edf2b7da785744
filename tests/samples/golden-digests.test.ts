/**
 * Golden digests: every committed sample under every golden setting replays to the digest in
 * tests/samples/digests.json, recorded under the current digest layout. A change to the engine's
 * numbers fails here until the layout is bumped and the file rewritten on purpose
 * (`npm run digests:update -- "why"`); tests/e2e/engine-digests.e2e.ts checks the same file in
 * Chromium, so Node and the browser are held to the same digests.
 */
import { describe, expect, it } from 'vitest';
import { DIGEST_LAYOUT, replayFromFiles } from '../../shared/engine';
import { GOLDEN_SETTINGS, readGoldenDigests, readSampleFiles, sampleFolders } from './golden-cases';

const golden = readGoldenDigests();

describe('golden digests', () => {
  it('are recorded for the current digest layout, for every sample and setting', () => {
    expect(golden.digestLayout).toBe(DIGEST_LAYOUT);
    expect(Object.keys(golden.samples).sort()).toEqual(sampleFolders().sort());
    for (const digests of Object.values(golden.samples))
      expect(Object.keys(digests).sort()).toEqual(Object.keys(GOLDEN_SETTINGS).sort());
  });

  for (const folder of sampleFolders()) {
    it(`${folder} replays to its golden digests`, () => {
      const files = readSampleFiles(folder);
      const actual: Record<string, string> = {};
      for (const [name, overrides] of Object.entries(GOLDEN_SETTINGS))
        actual[name] = replayFromFiles(files, overrides, { keyframeInterval: 0 }).digest;
      expect(actual).toEqual(golden.samples[folder]);
    });
  }
});
