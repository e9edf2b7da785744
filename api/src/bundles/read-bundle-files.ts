import type { BundleIssue } from '@shared/bundle/types';
import { consumeFileStream, InvalidTextError } from './consume-file-stream';
import { listFolderFiles } from './folder-files';
import type { BundleSource, InspectedFile } from './inspect-bundle';
import { ZipGuardError } from './zip-archive';
import { listZipFiles } from './zip-files';
import { DEFAULT_ZIP_LIMITS } from './zip-limits';

export type ReadBundleFiles =
  | { ok: true; files: Record<string, string>; inspected: InspectedFile[]; issues: BundleIssue[] }
  | { ok: false; issues: BundleIssue[] };

/**
 * A bundle (.zip or folder) as whole texts by bundle file name, for the engine's
 * `replayFromFiles`, with each file's size and SHA-256. Zip entries keep the listing's guards
 * (size, ratio, CRC); text must be UTF-8. The streaming `inspectBundle` stays the way to check
 * large uploads without holding them whole.
 */
export async function readBundleSourceFiles(source: BundleSource): Promise<ReadBundleFiles> {
  const name = source.path.split('/').pop() ?? source.path;
  const listing =
    source.kind === 'zip'
      ? await listZipFiles(source.path, name, DEFAULT_ZIP_LIMITS)
      : await listFolderFiles(source.path);
  if (!listing.ok) return { ok: false, issues: listing.issues };
  const issues = [...listing.issues];
  const files: Record<string, string> = {};
  const inspected: InspectedFile[] = [];
  try {
    for (const file of listing.files) {
      const parts: string[] = [];
      try {
        const consumed = await consumeFileStream(await file.open(), {
          onBytes: file.onBytes,
          onText: (text) => parts.push(text),
        });
        const problem = file.verify?.(consumed);
        if (problem) issues.push(problem);
        files[file.bundleName] = parts.join('');
        inspected.push({ name: file.name, size: consumed.size, sha256: consumed.sha256 });
      } catch (error) {
        if (error instanceof ZipGuardError)
          return {
            ok: false,
            issues: [...issues, { file: file.name, message: `zip refused: ${error.message}` }],
          };
        const message =
          error instanceof InvalidTextError ? error.message : `could not read: ${(error as Error).message}`;
        issues.push({ file: file.name, message });
      }
    }
  } finally {
    listing.close();
  }
  if (issues.some((issue) => issue.severity !== 'warning')) return { ok: false, issues };
  return { ok: true, files, inspected, issues };
}
