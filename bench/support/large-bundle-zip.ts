import fs from 'node:fs';
import path from 'node:path';
import { zipFolder } from '../../api/src/bundles/zip-folder';
import { makeLargeBundle } from '../../tools/simulator/make-samples';

/** The 10-minute, 6,000-scan sample bundle as a zip, generated on first use (git-ignored). */
export async function largeBundleZip(): Promise<string> {
  const zip = path.join(path.dirname(makeLargeBundlePath()), 'long-shift-10min.zip');
  if (fs.existsSync(zip)) return zip;
  const folder = fs.existsSync(makeLargeBundlePath()) ? makeLargeBundlePath() : makeLargeBundle();
  return zipFolder(folder, zip);
}

function makeLargeBundlePath(): string {
  return path.join(import.meta.dirname, '..', '..', 'sample-logs', 'large', 'long-shift-10min');
}
