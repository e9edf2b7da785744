import { createHash } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { pipeline } from 'node:stream/promises';
import type { TArchiveFileEntry } from '../../../shared/contracts/archives';
import {
  checkZipDirectory,
  createInflateGuard,
  openEntryStream,
  openZipArchive,
  ZipGuardError,
} from '../bundles/zip-archive';
import { DEFAULT_ZIP_LIMITS, type ZipLimits } from '../bundles/zip-limits';

export interface ReadArchive {
  /** Every file entry with its measured size and SHA-256, in archive order. */
  found: TArchiveFileEntry[];
  /** Paths that occur more than once (a zip can hide a second copy under the same name). */
  duplicates: string[];
  /** The small documents whose content is checked (JSON, signatures, digests), in memory. */
  contents: Map<string, Buffer>;
  /** Bundle originals (`*.zip`), extracted under `tempDir` for the replays. */
  extracted: Map<string, string>;
}

/** An archive refused before or while unpacking (a zip bomb, an unsafe name, a damaged entry). */
export class ArchiveRefusedError extends Error {
  constructor(readonly problems: { file: string; message: string }[]) {
    super(problems.map((p) => `${p.file}: ${p.message}`).join('; '));
    this.name = 'ArchiveRefusedError';
  }
}

/**
 * The one archive document allowed to be large is the audit chain (about 600 bytes an entry); 32 MiB
 * holds some fifty thousand entries. Documents together may take at most 64 MiB of memory, so
 * one request's memory stays bounded whatever the zip holds.
 */
export const MAX_DOCUMENT_BYTES = 32 * 1024 * 1024;
export const MAX_DOCUMENTS_TOTAL_BYTES = 64 * 1024 * 1024;

/** Entries whose content the verifier reads; everything else is only hashed as it streams by. */
const isCheckedDocument = (name: string) => /\.(json|jws)$/.test(name) || /\/digest$/.test(name);

/**
 * Reads every entry of an archive once, with the bundle reader's zip limits (directory checked
 * before anything is unpacked, inflated bytes counted as they come): hashes each entry while it
 * streams, keeps only the documents that are checked in memory (bounded), extracts originals
 * (`*.zip`) to `tempDir` and discards the rest, so memory stays flat whatever the archive holds.
 */
export async function readArchiveEntries(
  zipPath: string,
  tempDir: string,
  limits: ZipLimits = DEFAULT_ZIP_LIMITS,
): Promise<ReadArchive> {
  const opened = await openZipArchive(zipPath, path.basename(zipPath));
  if (!opened.ok) throw new Error(opened.issue.message);
  const { zip, entries } = opened;
  const result: ReadArchive = { found: [], duplicates: [], contents: new Map(), extracted: new Map() };
  try {
    const firstOfName = new Map<string, (typeof entries)[number]>();
    for (const info of entries) if (!firstOfName.has(info.name)) firstOfName.set(info.name, info);
    // The directory check refuses repeated names; the verifier reports them as a failed check instead.
    const refusals = checkZipDirectory([...firstOfName.values()], limits, path.basename(zipPath));
    let documentBytes = 0;
    for (const { name, entry, isDirectory } of entries) {
      if (isDirectory || !isCheckedDocument(name)) continue;
      documentBytes += entry.uncompressedSize;
      if (entry.uncompressedSize > MAX_DOCUMENT_BYTES)
        refusals.push({
          file: name,
          message: `archive document refused: ${entry.uncompressedSize} bytes, more than the ${MAX_DOCUMENT_BYTES} bytes a checked document may have`,
        });
    }
    if (documentBytes > MAX_DOCUMENTS_TOTAL_BYTES)
      refusals.push({
        file: path.basename(zipPath),
        message: `archive refused: its documents add up to ${documentBytes} bytes, more than the ${MAX_DOCUMENTS_TOTAL_BYTES} bytes checked at once`,
      });
    if (refusals.length > 0) throw new ArchiveRefusedError(refusals);

    const seen = new Set<string>();
    const totals = { bytes: 0 };
    let extractedCount = 0;
    for (const info of entries) {
      const { name } = info;
      if (info.isDirectory) continue;
      if (seen.has(name)) result.duplicates.push(name);
      seen.add(name);
      const guard = createInflateGuard(info, limits, totals);
      const hash = createHash('sha256');
      let size = 0;
      const keep = isCheckedDocument(name) ? ([] as Buffer[]) : null;
      const target = name.endsWith('.zip') ? path.join(tempDir, `entry-${extractedCount++}.bin`) : null;
      const stream = await openEntryStream(zip, info);
      try {
        await pipeline(
          stream,
          async function* (source: AsyncIterable<Buffer>) {
            for await (const chunk of source) {
              size += chunk.length;
              guard(size, chunk.length);
              if (keep && size > MAX_DOCUMENT_BYTES)
                throw new ZipGuardError(`more than ${MAX_DOCUMENT_BYTES} bytes; unpacking stopped`);
              hash.update(chunk);
              if (keep) keep.push(chunk);
              else if (target) yield chunk;
            }
          },
          target
            ? fs.createWriteStream(target)
            : async (source: AsyncIterable<Buffer>) => {
                for await (const _ of source);
              },
        );
      } catch (error) {
        if (error instanceof ZipGuardError)
          throw new ArchiveRefusedError([{ file: name, message: `zip entry refused: ${error.message}` }]);
        throw error;
      }
      result.found.push({ path: name, size, sha256: hash.digest('hex') });
      if (keep) result.contents.set(name, Buffer.concat(keep));
      else if (target) result.extracted.set(name, target);
    }
  } finally {
    zip.close();
  }
  return result;
}
