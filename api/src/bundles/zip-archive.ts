import { open as openFile } from 'node:fs/promises';
import type { Readable } from 'node:stream';
import type { BundleIssue } from '@shared/bundle/types';
import yauzl from 'yauzl';
import { findUnsafeEntryPath } from './zip-entry-path';
import type { ZipLimits } from './zip-limits';

export interface ZipEntryInfo {
  /** Name as stored (backslashes kept), checked by `checkZipDirectory`. */
  name: string;
  isDirectory: boolean;
  entry: yauzl.Entry;
}

export type OpenZipResult =
  | { ok: true; zip: yauzl.ZipFile; entries: ZipEntryInfo[] }
  | { ok: false; issue: BundleIssue };

/** Thrown from a byte counter to abort inflating an entry that breaks the limits. */
export class ZipGuardError extends Error {}

const LOCAL_HEADER_SIGNATURE = 0x04034b50;

/**
 * Opens a zip and reads its central directory (no entry data yet). Names are decoded without
 * yauzl's own validation so an unsafe name is reported per entry instead of failing the whole zip.
 */
export async function openZipArchive(path: string, zipName: string): Promise<OpenZipResult> {
  let zip: yauzl.ZipFile;
  try {
    zip = await yauzl.openPromise(path, {
      lazyEntries: true,
      autoClose: false,
      decodeStrings: false,
      validateEntrySizes: false,
    });
  } catch (error) {
    return { ok: false, issue: await describeOpenFailure(path, zipName, error as Error) };
  }
  const entries: ZipEntryInfo[] = [];
  try {
    for await (const entry of zip.eachEntry()) {
      const raw = entry.fileNameRaw ?? (entry.fileName as unknown as Buffer);
      const name = yauzl.getFileNameLowLevel(entry.generalPurposeBitFlag, raw, entry.extraFields, true);
      entries.push({ name, isDirectory: name.endsWith('/'), entry });
    }
  } catch (error) {
    zip.close();
    return {
      ok: false,
      issue: { file: zipName, message: `damaged zip directory: ${(error as Error).message}` },
    };
  }
  return { ok: true, zip, entries };
}

async function describeOpenFailure(path: string, zipName: string, error: Error): Promise<BundleIssue> {
  const handle = await openFile(path, 'r');
  const head = Buffer.alloc(4);
  try {
    await handle.read(head, 0, 4, 0);
  } finally {
    await handle.close();
  }
  // A file that starts like a zip but has no end record was cut short (an interrupted copy or upload).
  if (head.readUInt32LE(0) === LOCAL_HEADER_SIGNATURE) {
    return {
      file: zipName,
      message: `truncated or damaged zip: ${error.message}`,
      expected: 'a complete .zip file',
    };
  }
  return { file: zipName, message: 'not a zip file', expected: 'a .zip archive', found: describeHead(head) };
}

function describeHead(head: Buffer): string {
  const text = head.toString('latin1');
  return /^[\x20-\x7e]+$/.test(text)
    ? `content starting with ${JSON.stringify(text)}`
    : `bytes ${head.toString('hex')}`;
}

/**
 * Checks every entry from the central directory BEFORE anything is unpacked: names that leave the
 * root, encrypted or unreadable entries, duplicates, and the size and ratio limits.
 */
export function checkZipDirectory(
  entries: ZipEntryInfo[],
  limits: ZipLimits,
  zipName: string,
): BundleIssue[] {
  const issues: BundleIssue[] = [];
  const seen = new Set<string>();
  let total = 0;
  for (const { name, entry, isDirectory } of entries) {
    const unsafe = findUnsafeEntryPath(name);
    if (unsafe) {
      issues.push({
        file: name,
        message: `zip entry refused: ${unsafe}`,
        expected: 'a relative path inside the bundle',
      });
      continue;
    }
    if (seen.has(name))
      issues.push({ file: name, message: 'zip entry refused: the same name appears twice' });
    seen.add(name);
    if (isDirectory) continue;
    if (entry.isEncrypted())
      issues.push({ file: name, message: 'zip entry refused: encrypted entries are not supported' });
    else if (!entry.canDecodeFileData()) {
      issues.push({
        file: name,
        message: `zip entry refused: unsupported compression method ${entry.compressionMethod}`,
        expected: 'stored or deflate',
      });
    }
    total += entry.uncompressedSize;
    const ratio = entry.uncompressedSize / Math.max(1, entry.compressedSize);
    if (entry.uncompressedSize > limits.maxEntryBytes && ratio > limits.maxRatio) {
      issues.push({
        file: name,
        message: 'zip entry refused: unpacks too large at too high a compression ratio (possible zip bomb)',
        expected: `at most ${limits.maxEntryBytes} bytes, or a ratio of at most ${limits.maxRatio}:1`,
        found: `${entry.uncompressedSize} bytes at ${Math.round(ratio)}:1`,
      });
    }
  }
  if (total > limits.maxTotalBytes) {
    issues.push({
      file: zipName,
      message: 'zip refused: total unpacked size is over the limit',
      expected: `at most ${limits.maxTotalBytes} bytes`,
      found: `${total} bytes`,
    });
  }
  return issues;
}

/** Counts the bytes actually inflated: the directory can lie, the inflater cannot. */
export function createInflateGuard(info: ZipEntryInfo, limits: ZipLimits, totals: { bytes: number }) {
  const { uncompressedSize: declared, compressedSize } = info.entry;
  return (entryBytes: number, chunkLength: number): void => {
    totals.bytes += chunkLength;
    if (entryBytes > declared) {
      throw new ZipGuardError(
        `entry unpacks to more than the ${declared} bytes the zip directory declares; unpacking stopped`,
      );
    }
    if (totals.bytes > limits.maxTotalBytes) {
      throw new ZipGuardError(
        `zip unpacks to more than ${limits.maxTotalBytes} bytes in total; unpacking stopped`,
      );
    }
    if (entryBytes > limits.maxEntryBytes && entryBytes / Math.max(1, compressedSize) > limits.maxRatio) {
      throw new ZipGuardError('entry unpacks too large at too high a compression ratio; unpacking stopped');
    }
  };
}

export function openEntryStream(zip: yauzl.ZipFile, info: ZipEntryInfo): Promise<Readable> {
  return zip.openReadStreamPromise(info.entry);
}
