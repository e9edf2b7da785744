/**
 * The committed samples and the settings their golden digests are recorded for
 * (tests/samples/digests.json): the manifest's own filter, recovery on (the what-if the samples
 * are about), and a smaller stratified filter with another seed. Shared by the Node check, the
 * Chromium check and the tool that rewrites the file (`npm run digests:update`).
 */
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';

// From import.meta.url, not import.meta.dirname: the Debian Node 18 check runs this file too.
export const SAMPLES_DIR = fileURLToPath(new URL('../../sample-logs', import.meta.url));
export const GOLDEN_DIGESTS_FILE = fileURLToPath(new URL('./digests.json', import.meta.url));

export const GOLDEN_SETTINGS: Record<string, Record<string, unknown>> = {
  manifest: {},
  recovery: { recovery: true },
  'stratified-300-seed-7': { particles: 300, resampling_method: 'stratified', seed: 7 },
};

export interface GoldenDigests {
  format: 'driftcase-golden-digests/1';
  digestLayout: number;
  engine: string;
  /** Why the digests last changed. */
  note: string;
  /** sample folder → settings name → digest */
  samples: Record<string, Record<string, string>>;
}

export function sampleFolders(): string[] {
  const catalog = JSON.parse(readFileSync(join(SAMPLES_DIR, 'catalog.json'), 'utf8')) as {
    samples: { folder: string }[];
  };
  return catalog.samples.map((sample) => sample.folder);
}

/** A sample's files as text, keyed by bundle file name. */
export function readSampleFiles(folder: string): Record<string, string> {
  const files: Record<string, string> = {};
  for (const name of readdirSync(join(SAMPLES_DIR, folder)))
    files[name] = readFileSync(join(SAMPLES_DIR, folder, name), 'utf8');
  return files;
}

export function readGoldenDigests(): GoldenDigests {
  return JSON.parse(readFileSync(GOLDEN_DIGESTS_FILE, 'utf8')) as GoldenDigests;
}
