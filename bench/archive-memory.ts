/**
 * Peak memory while streaming an evidence archive with a large original.
 * `npx tsx bench/archive-memory.ts [MiB]` (default 256): writes a pseudo-random file of that size
 * (incompressible, the worst case for deflate), streams it through the archive writer into a
 * file, and reports peak RSS against the exported size. RSS should stay near the baseline.
 */
import { createHash } from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import { writeArchive } from '../api/src/archive/write-archive';
import { ARCHIVE_FORMAT } from '../shared/contracts/archives';

function writeRandomFile(file: string, bytes: number): { sha256: string } {
  const hash = createHash('sha256');
  const fd = fs.openSync(file, 'w');
  const block = Buffer.alloc(1 << 20);
  let state = 0x9e3779b9;
  for (let written = 0; written < bytes; written += block.length) {
    for (let i = 0; i < block.length; i += 4) {
      // xorshift32: cheap bytes that deflate cannot shrink.
      state ^= state << 13;
      state ^= state >>> 17;
      state ^= state << 5;
      block.writeUInt32LE(state >>> 0, i);
    }
    hash.update(block);
    fs.writeSync(fd, block);
  }
  fs.closeSync(fd);
  return { sha256: hash.digest('hex') };
}

/** Streams an archive holding one generated original of `mebibytes` MiB and reports peak RSS. */
export async function run(mebibytes = 256) {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'driftcase-bench-archive-'));
  const original = path.join(dir, 'original.bin');
  const size = mebibytes * 1024 * 1024;
  const { sha256 } = writeRandomFile(original, size);
  global.gc?.();
  const baseline = process.memoryUsage().rss;
  let peak = baseline;
  const sampler = setInterval(() => {
    peak = Math.max(peak, process.memoryUsage().rss);
  }, 50);
  const started = performance.now();
  const sink = fs.createWriteStream(path.join(dir, 'archive.zip'));
  const written = await writeArchive(
    [
      { path: 'case.json', data: Buffer.from('{"bench":true}\n') },
      { path: `bundles/${sha256}/original.zip`, file: original, expectedSha256: sha256, expectedSize: size },
    ],
    sink,
    (files) => ({
      format: ARCHIVE_FORMAT,
      case: { id: 'bench', reference: 'BENCH-1', title: 'Generated bundle' },
      exportedAt: new Date().toISOString(),
      exportedBy: { id: 'bench', email: 'bench@driftcase.example', role: 'legal' },
      productVersion: 'bench',
      safetyCaution: '',
      files,
    }),
    async () => 'unsigned..bench',
  );
  await new Promise<void>((resolve) => sink.end(resolve));
  clearInterval(sampler);
  const mb = (n: number) => (n / 1024 / 1024).toFixed(1);
  fs.rmSync(dir, { recursive: true, force: true });
  return {
    name: 'stream an evidence archive with a large original',
    originalMiB: mebibytes,
    archiveMiB: Number(mb(written.size)),
    seconds: Number(((performance.now() - started) / 1000).toFixed(1)),
    baselineRssMiB: Number(mb(baseline)),
    peakRssMiB: Number(mb(peak)),
    growthMiB: Number(mb(peak - baseline)),
  };
}

if (import.meta.url === pathToFileURL(process.argv[1]).href) {
  console.log(JSON.stringify(await run(Number(process.argv[2] ?? 256))));
}
