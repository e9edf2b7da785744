import { createHash } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { pipeline } from 'node:stream/promises';
import yauzl from 'yauzl';
import type { TArchiveFileEntry } from '../../../shared/contracts/archives';

export interface ReadArchive {
  /** Every file entry with its measured size and SHA-256, in archive order. */
  found: TArchiveFileEntry[];
  /** Paths that occur more than once (a zip can hide a second copy under the same name). */
  duplicates: string[];
  /** Small files kept in memory for the content checks. */
  contents: Map<string, Buffer>;
  /** Large files (bundle originals) extracted under `tempDir`. */
  extracted: Map<string, string>;
}

/** Entries up to this size are kept in memory; larger ones are written to the temp folder. */
const IN_MEMORY_LIMIT = 64 * 1024 * 1024;

/**
 * Reads every entry of an archive once: hashes it, keeps small files in memory and extracts
 * originals (`*.zip`) to `tempDir`, so memory stays bounded for large evidence.
 */
export async function readArchiveEntries(zipPath: string, tempDir: string): Promise<ReadArchive> {
  const zip = await yauzl.openPromise(zipPath, { lazyEntries: true, autoClose: false });
  const result: ReadArchive = { found: [], duplicates: [], contents: new Map(), extracted: new Map() };
  const seen = new Set<string>();
  let extractedCount = 0;
  try {
    for await (const entry of zip.eachEntry()) {
      const name = entry.fileName;
      if (name.endsWith('/')) continue;
      if (seen.has(name)) result.duplicates.push(name);
      seen.add(name);
      const hash = createHash('sha256');
      let size = 0;
      const keep =
        name.endsWith('.zip') || entry.uncompressedSize > IN_MEMORY_LIMIT ? null : ([] as Buffer[]);
      const target = keep ? null : path.join(tempDir, `entry-${extractedCount++}.bin`);
      const stream = await zip.openReadStreamPromise(entry);
      await pipeline(
        stream,
        async function* (source: AsyncIterable<Buffer>) {
          for await (const chunk of source) {
            hash.update(chunk);
            size += chunk.length;
            if (keep) keep.push(chunk);
            else yield chunk;
          }
        },
        target
          ? fs.createWriteStream(target)
          : async (source: AsyncIterable<Buffer>) => {
              for await (const _ of source);
            },
      );
      result.found.push({ path: name, size, sha256: hash.digest('hex') });
      if (keep) result.contents.set(name, Buffer.concat(keep));
      else if (target) result.extracted.set(name, target);
    }
  } finally {
    zip.close();
  }
  return result;
}
