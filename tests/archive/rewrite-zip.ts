import fs from 'node:fs';
import { ZipArchive } from 'archiver';
import yauzl from 'yauzl';

/** All entries of a zip as name → bytes, in archive order. */
export async function readZipEntries(file: string): Promise<Map<string, Buffer>> {
  const zip = await yauzl.openPromise(file, { lazyEntries: true });
  const out = new Map<string, Buffer>();
  for await (const entry of zip.eachEntry()) {
    const chunks: Buffer[] = [];
    for await (const chunk of await zip.openReadStreamPromise(entry)) chunks.push(chunk as Buffer);
    out.set(entry.fileName, Buffer.concat(chunks));
  }
  return out;
}

/** Writes a new zip from entries, as someone tampering with an archive would. */
export async function writeZipEntries(file: string, entries: Map<string, Buffer>): Promise<string> {
  const archive = new ZipArchive({ zlib: { level: 1 } });
  const output = fs.createWriteStream(file);
  const closed = new Promise<void>((resolve, reject) => {
    output.on('close', resolve);
    archive.on('error', reject);
  });
  archive.pipe(output);
  for (const [name, data] of entries) archive.append(data, { name });
  await archive.finalize();
  await closed;
  return file;
}
