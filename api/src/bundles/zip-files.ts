import type { BundleIssue } from '@shared/bundle/types';
import type { BundleFileSource, FileListing } from './inspect-bundle';
import {
  checkZipDirectory,
  createInflateGuard,
  openEntryStream,
  openZipArchive,
  type ZipEntryInfo,
} from './zip-archive';
import type { ZipLimits } from './zip-limits';

/** Folders and files that archivers add on their own (macOS Finder); never a reason for the prefix logic. */
const ARCHIVER_NOISE = /(^|\/)(__MACOSX\/|\.DS_Store$)/;

/**
 * The folder that holds the bundle inside the zip: the root, or the single top-level folder
 * that people get when they zip a folder rather than its contents.
 */
export function findBundleRoot(names: string[]): string {
  const files = names.filter((name) => !name.endsWith('/') && !ARCHIVER_NOISE.test(name));
  if (files.includes('manifest.json') || files.length === 0) return '';
  const top = files[0].split('/')[0];
  const isSingleFolder = files.every((name) => name.startsWith(`${top}/`));
  return isSingleFolder && files.includes(`${top}/manifest.json`) ? `${top}/` : '';
}

/**
 * Opens a zip, refuses it from its directory when an entry is unsafe or too large, and otherwise
 * returns its files as streams guarded by a shared inflated-byte counter.
 */
export async function listZipFiles(path: string, zipName: string, limits: ZipLimits): Promise<FileListing> {
  const opened = await openZipArchive(path, zipName);
  if (!opened.ok) return { ok: false, issues: [opened.issue] };
  const { zip, entries } = opened;
  const refusals = checkZipDirectory(entries, limits, zipName);
  if (refusals.length > 0) {
    zip.close();
    return { ok: false, issues: refusals };
  }
  const root = findBundleRoot(entries.map((entry) => entry.name));
  const totals = { bytes: 0 };
  const files: BundleFileSource[] = entries
    .filter((info) => !info.isDirectory)
    .map((info) => ({
      name: info.name,
      bundleName: root && info.name.startsWith(root) ? info.name.slice(root.length) : info.name,
      open: () => openEntryStream(zip, info),
      onBytes: createInflateGuard(info, limits, totals),
      verify: (consumed) => verifyEntry(info, consumed.size, consumed.crc32),
    }));
  if (files.length === 0) {
    zip.close();
    return { ok: false, issues: [{ file: zipName, message: 'zip has no files' }] };
  }
  return { ok: true, files, issues: [], close: () => zip.close() };
}

function verifyEntry(info: ZipEntryInfo, size: number, checksum: number): BundleIssue | undefined {
  if (size < info.entry.uncompressedSize) {
    return {
      file: info.name,
      message: 'entry is shorter than the zip directory declares (truncated or damaged zip)',
      expected: `${info.entry.uncompressedSize} bytes`,
      found: `${size} bytes`,
    };
  }
  if (checksum >>> 0 !== info.entry.crc32 >>> 0) {
    return { file: info.name, message: 'entry is damaged: its CRC-32 does not match the zip directory' };
  }
  return undefined;
}
