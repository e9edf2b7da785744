import { createHash } from 'node:crypto';
import { mkdtempSync, readdirSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { makeAllSamples, SAMPLE_LOGS_DIR } from '../../../tools/simulator/make-samples';

function sha256Of(path: string): string {
  return createHash('sha256').update(readFileSync(path)).digest('hex');
}

/** Relative path → SHA-256 (FIPS 180-4, via Node's crypto) of every file under `root`. */
function hashTree(root: string): Record<string, string> {
  const hashes: Record<string, string> = {};
  for (const entry of readdirSync(root, { withFileTypes: true })) {
    if (entry.name === 'large') continue; // benchmark bundles are not committed
    if (entry.isDirectory()) {
      for (const file of readdirSync(join(root, entry.name))) {
        hashes[`${entry.name}/${file}`] = sha256Of(join(root, entry.name, file));
      }
    } else {
      hashes[entry.name] = sha256Of(join(root, entry.name));
    }
  }
  return hashes;
}

describe('npm run samples', () => {
  const outDir = mkdtempSync(join(tmpdir(), 'driftcase-samples-'));
  afterAll(() => rmSync(outDir, { recursive: true, force: true }));

  it('regenerates the committed sample bundles byte for byte', () => {
    makeAllSamples(outDir);
    const committed = hashTree(SAMPLE_LOGS_DIR);
    const regenerated = hashTree(outDir);
    expect(Object.keys(regenerated).length).toBeGreaterThan(30);
    expect(regenerated).toEqual(committed);
  });
});
