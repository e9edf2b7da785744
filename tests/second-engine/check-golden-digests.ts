/**
 * Replays every sample under every golden setting and compares with tests/samples/digests.json.
 * Written for a second JavaScript engine: tests/second-engine/run-debian-node.sh bundles it with
 * esbuild and runs it on Debian's own nodejs package (Node 18, V8 10.2), which cannot run the CLI
 * itself (the zip reader needs node:zlib crc32, Node >= 20.15). Prints one line per case and
 * "N passed, N failed"; exits 1 on any mismatch.
 */
import { replayFromFiles } from '../../shared/engine';
import { GOLDEN_SETTINGS, readGoldenDigests, readSampleFiles, sampleFolders } from '../samples/golden-cases';

const golden = readGoldenDigests();
let passed = 0;
let failed = 0;
process.stdout.write(`runtime: node ${process.version} (V8 ${process.versions.v8})\n`);
for (const folder of sampleFolders()) {
  const files = readSampleFiles(folder);
  for (const [name, overrides] of Object.entries(GOLDEN_SETTINGS)) {
    const digest = replayFromFiles(files, overrides, { keyframeInterval: 0 }).digest;
    const expected = golden.samples[folder]?.[name];
    if (digest === expected) passed++;
    else failed++;
    process.stdout.write(
      `${digest === expected ? 'ok  ' : 'FAIL'} ${folder} ${name} ${digest}${digest === expected ? '' : ` (golden ${expected})`}\n`,
    );
  }
}
process.stdout.write(`${passed} passed, ${failed} failed\n`);
process.exitCode = failed > 0 ? 1 : 0;
