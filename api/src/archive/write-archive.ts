import { createHash } from 'node:crypto';
import fs from 'node:fs';
import { PassThrough, Transform, type Writable } from 'node:stream';
import { ZipArchive } from 'archiver';
import {
  FIXED_ENTRY_DATE,
  MANIFEST_PATH,
  MANIFEST_SIGNATURE_PATH,
} from '../../../shared/archive/archive-layout';
import type { TArchiveFileEntry, TArchiveManifest } from '../../../shared/contracts/archives';
import type { ArchiveEntry } from './archive-entries';

export interface WrittenArchive {
  /** SHA-256 of the zip bytes as they left for the sink. */
  sha256: string;
  /** bytes */
  size: number;
  files: TArchiveFileEntry[];
}

export class EvidenceMismatchError extends Error {}

/** Hashes what flows through, for files too large to hold in memory. */
function hashingStream(onDone: (sha256: string, size: number) => void): Transform {
  const hash = createHash('sha256');
  let size = 0;
  return new Transform({
    transform(chunk: Buffer, _encoding, callback) {
      hash.update(chunk);
      size += chunk.length;
      callback(null, chunk);
    },
    flush(callback) {
      onDone(hash.digest('hex'), size);
      callback();
    },
  });
}

/**
 * Streams a zip of `entries` (in order), then `manifest.json` listing them all with size and
 * SHA-256, then its detached signature, into `sink` (which it does not end). Originals are read from disk chunk by chunk,
 * so memory does not grow with the evidence. An original whose bytes no longer match its recorded
 * hash aborts the archive: a copy that is not the evidence must never look like it.
 */
export async function writeArchive(
  entries: readonly ArchiveEntry[],
  sink: Writable,
  manifestFor: (files: TArchiveFileEntry[]) => TArchiveManifest,
  signManifest: (manifestBytes: Uint8Array) => Promise<string>,
): Promise<WrittenArchive> {
  const archive = new ZipArchive({ zlib: { level: 9 } });
  const archiveHash = createHash('sha256');
  let archiveSize = 0;
  const counter = new PassThrough();
  counter.on('data', (chunk: Buffer) => {
    archiveHash.update(chunk);
    archiveSize += chunk.length;
  });
  // The sink is left open: the caller records custody first, then ends it, so whoever receives
  // the last byte can already find the audit entry.
  const finished = new Promise<void>((resolve, reject) => {
    counter.on('end', resolve);
    sink.on('error', reject);
    sink.on('close', () =>
      reject(new Error('The receiver closed the connection before the archive was complete.')),
    );
    archive.on('error', reject);
  });
  finished.catch(() => undefined);
  archive.pipe(counter).pipe(sink, { end: false });

  const files: TArchiveFileEntry[] = [];
  const hashed: Promise<void>[] = [];
  for (const entry of entries) {
    const options = { name: entry.path, date: FIXED_ENTRY_DATE };
    if ('data' in entry) {
      const sha256 = createHash('sha256').update(entry.data).digest('hex');
      files.push({ path: entry.path, size: entry.data.length, sha256 });
      archive.append(entry.data, options);
      continue;
    }
    const listed: TArchiveFileEntry = { path: entry.path, size: 0, sha256: '' };
    files.push(listed);
    hashed.push(
      new Promise((resolve, reject) => {
        const hasher = hashingStream((sha256, size) => {
          Object.assign(listed, { sha256, size });
          if (sha256 !== entry.expectedSha256 || size !== entry.expectedSize) {
            const error = new EvidenceMismatchError(
              `The stored original ${entry.file} no longer matches its recorded SHA-256 ${entry.expectedSha256} (found ${sha256}); export refused.`,
            );
            archive.abort();
            reject(error);
          } else resolve();
        });
        archive.append(fs.createReadStream(entry.file).on('error', reject).pipe(hasher), options);
      }),
    );
  }
  await Promise.all(hashed);
  const manifestBytes = Buffer.from(`${JSON.stringify(manifestFor(files), null, 2)}\n`, 'utf8');
  archive.append(manifestBytes, { name: MANIFEST_PATH, date: FIXED_ENTRY_DATE });
  archive.append(await signManifest(manifestBytes), {
    name: MANIFEST_SIGNATURE_PATH,
    date: FIXED_ENTRY_DATE,
  });
  await archive.finalize();
  await finished;
  return { sha256: archiveHash.digest('hex'), size: archiveSize, files };
}
