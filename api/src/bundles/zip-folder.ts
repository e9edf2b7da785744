import { createWriteStream } from 'node:fs';
import { readdir } from 'node:fs/promises';
import path from 'node:path';
import { ZipArchive } from 'archiver';

/** Zips the files at the root of `folder` (sorted, fixed dates) so the same folder gives the same bytes. */
export async function zipFolder(folder: string, zipPath: string): Promise<string> {
  const archive = new ZipArchive({ zlib: { level: 9 } });
  const output = createWriteStream(zipPath);
  const closed = new Promise<void>((resolve, reject) => {
    output.on('close', resolve);
    output.on('error', reject);
    archive.on('error', reject);
  });
  archive.pipe(output);
  const entries = (await readdir(folder, { withFileTypes: true })).filter((entry) => entry.isFile());
  for (const name of entries.map((entry) => entry.name).sort()) {
    archive.file(path.join(folder, name), { name, date: new Date('2026-01-01T00:00:00Z') });
  }
  await archive.finalize();
  await closed;
  return zipPath;
}
