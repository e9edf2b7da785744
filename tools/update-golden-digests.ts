/**
 * Rewrites tests/samples/digests.json from the current engine. Run it only on purpose, after a
 * change to the engine's numbers, together with a DIGEST_LAYOUT bump and a history line in
 * shared/engine/engine-version.ts: `npm run digests:update -- "why the numbers changed"`.
 */
import { writeFileSync } from 'node:fs';
import { DIGEST_LAYOUT, ENGINE_VERSION, replayFromFiles } from '../shared/engine';
import {
  GOLDEN_DIGESTS_FILE,
  GOLDEN_SETTINGS,
  type GoldenDigests,
  readSampleFiles,
  sampleFolders,
} from '../tests/samples/golden-cases';

const note = process.argv.slice(2).join(' ').trim();
if (!note) {
  process.stderr.write(
    'Give the reason the digests change, e.g. npm run digests:update -- "ziggurat motion noise"\n',
  );
  process.exit(2);
}
const golden: GoldenDigests = {
  format: 'driftcase-golden-digests/1',
  digestLayout: DIGEST_LAYOUT,
  engine: ENGINE_VERSION,
  note,
  samples: {},
};
for (const folder of sampleFolders()) {
  const files = readSampleFiles(folder);
  golden.samples[folder] = {};
  for (const [name, overrides] of Object.entries(GOLDEN_SETTINGS)) {
    golden.samples[folder][name] = replayFromFiles(files, overrides, { keyframeInterval: 0 }).digest;
    process.stdout.write(`${folder} ${name} ${golden.samples[folder][name]}\n`);
  }
}
writeFileSync(GOLDEN_DIGESTS_FILE, `${JSON.stringify(golden, null, 2)}\n`);
process.stdout.write(`Wrote ${GOLDEN_DIGESTS_FILE}\n`);
