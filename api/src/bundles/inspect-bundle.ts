import { stat } from 'node:fs/promises';
import { basename } from 'node:path';
import type { Readable } from 'node:stream';
import { type BundleReader, createBundleReader, isBundleFileName } from '@shared/bundle/bundle-reader';
import { LineSplitter, LineTooLongError } from '@shared/bundle/line-splitter';
import { type BundleSummary, summarizeBundle } from '@shared/bundle/summarize-bundle';
import type { Bundle, BundleIssue } from '@shared/bundle/types';
import { type ConsumedFile, consumeFileStream, InvalidTextError } from './consume-file-stream';
import { listFolderFiles } from './folder-files';
import { ZipGuardError } from './zip-archive';
import { listZipFiles } from './zip-files';
import { DEFAULT_ZIP_LIMITS, type ZipLimits } from './zip-limits';

export type BundleSource = { kind: 'zip' | 'folder'; path: string };

export interface InspectedFile {
  /** Path inside the zip or folder, as stored. */
  name: string;
  /** bytes */
  size: number;
  /** SHA-256 of the file's bytes, lowercase hex. */
  sha256: string;
}

export interface BundleInspection {
  ok: boolean;
  issues: BundleIssue[];
  files: InspectedFile[];
  summary?: BundleSummary;
  bundle?: Bundle;
}

/** One file of a bundle, ready to be streamed once. */
export interface BundleFileSource {
  /** Path as stored, used in the file list and in issues. */
  name: string;
  /** Name relative to the bundle root, matched against the format's file names. */
  bundleName: string;
  open(): Promise<Readable>;
  /** Byte counter that throws `ZipGuardError` to stop unpacking. */
  onBytes?: (entryBytes: number, chunkLength: number) => void;
  /** Integrity check after the last byte (zip size and CRC); returns a problem or undefined. */
  verify?: (consumed: ConsumedFile) => BundleIssue | undefined;
}

export type FileListing =
  | { ok: true; files: BundleFileSource[]; issues: BundleIssue[]; close(): void }
  | { ok: false; issues: BundleIssue[] };

/**
 * Validates a bundle (.zip or folder) by streaming each file once: hashing its bytes and feeding
 * its lines to the incremental parsers, so only the parsed columns stay in memory. Zip entries are
 * checked against `limits` from the directory before unpacking and again while inflating.
 */
export async function inspectBundle(
  source: BundleSource,
  limits: Partial<ZipLimits> = {},
): Promise<BundleInspection> {
  const name = basename(source.path);
  const info = await stat(source.path).catch(() => undefined);
  if (!info) return failed({ file: name, message: 'no such file or folder' });
  if (source.kind === 'zip' && !info.isFile())
    return failed({ file: name, message: 'not a file', expected: 'a .zip file' });
  if (source.kind === 'folder' && !info.isDirectory()) return failed({ file: name, message: 'not a folder' });
  if (source.kind === 'zip' && info.size === 0)
    return failed({ file: name, message: 'empty file (0 bytes)', expected: 'a .zip archive' });

  const listing =
    source.kind === 'zip'
      ? await listZipFiles(source.path, name, { ...DEFAULT_ZIP_LIMITS, ...limits })
      : await listFolderFiles(source.path);
  if (!listing.ok) return { ok: false, issues: listing.issues, files: [] };
  try {
    return await readListedFiles(listing.files, listing.issues);
  } finally {
    listing.close();
  }
}

function failed(issue: BundleIssue): BundleInspection {
  return { ok: false, issues: [issue], files: [] };
}

/** The manifest first (scans and detections are checked against it), then the map, then the rest. */
function readingOrder(file: BundleFileSource): number {
  if (file.bundleName === 'manifest.json') return 0;
  if (file.bundleName === 'map.json') return 1;
  return isBundleFileName(file.bundleName) ? 2 : 3;
}

async function readListedFiles(
  sources: BundleFileSource[],
  listingIssues: BundleIssue[],
): Promise<BundleInspection> {
  const reader = createBundleReader();
  for (const issue of listingIssues) reader.addIssue(issue);
  const files: InspectedFile[] = [];
  const ordered = [...sources].sort((a, b) => readingOrder(a) - readingOrder(b));
  for (const source of ordered) {
    try {
      const consumed = await readOneFile(source, reader);
      files.push({ name: source.name, size: consumed.size, sha256: consumed.sha256 });
      const problem = source.verify?.(consumed);
      if (problem) reader.addIssue(problem);
    } catch (error) {
      if (error instanceof ZipGuardError) {
        // Refuse the whole archive: nothing more is unpacked once it has shown itself hostile.
        reader.addIssue({ file: source.name, message: `zip refused: ${error.message}` });
        return { ok: false, issues: reader.finish().issues, files };
      }
      if (error instanceof LineTooLongError) {
        reader.addIssue({ file: source.name, line: error.lineNumber, message: error.message });
        continue;
      }
      const message =
        error instanceof InvalidTextError ? error.message : `could not read: ${(error as Error).message}`;
      reader.addIssue({ file: source.name, message });
    }
  }
  const result = reader.finish();
  if (!result.ok) return { ok: false, issues: result.issues, files };
  return {
    ok: true,
    issues: result.issues,
    files,
    bundle: result.bundle,
    summary: summarizeBundle(result.bundle),
  };
}

async function readOneFile(source: BundleFileSource, reader: BundleReader): Promise<ConsumedFile> {
  const stream = await source.open();
  const name = source.bundleName;
  if (!isBundleFileName(name)) {
    reader.noteExtraFile(source.name);
    return consumeFileStream(stream, { onBytes: source.onBytes });
  }
  if (name === 'manifest.json' || name === 'map.json') {
    // Small documents: collected as text once, then parsed whole.
    const parts: string[] = [];
    const consumed = await consumeFileStream(stream, {
      onBytes: source.onBytes,
      onText: (text) => parts.push(text),
    });
    if (name === 'manifest.json') reader.readManifest(parts.join(''));
    else reader.readMap(parts.join(''));
    return consumed;
  }
  const sink = reader.openTable(name);
  const splitter = new LineSplitter(sink.pushLine);
  const consumed = await consumeFileStream(stream, {
    onBytes: source.onBytes,
    onText: (text) => splitter.push(text),
  });
  splitter.end();
  sink.finish();
  return consumed;
}
