import { createReadStream } from 'node:fs';
import { readdir } from 'node:fs/promises';
import { basename, join } from 'node:path';
import type { BundleIssue } from '@shared/bundle/types';
import type { FileListing } from './inspect-bundle';

/** Lists the files at a bundle folder's root; subfolders are not part of the format. */
export async function listFolderFiles(path: string): Promise<FileListing> {
  const entries = await readdir(path, { withFileTypes: true });
  const issues: BundleIssue[] = [];
  const files = entries
    .filter((entry) => {
      if (entry.isFile()) return true;
      issues.push({
        file: `${entry.name}/`,
        message: 'subfolder or special file ignored',
        severity: 'warning',
      });
      return false;
    })
    .map((entry) => ({
      name: entry.name,
      bundleName: entry.name,
      open: async () => createReadStream(join(path, entry.name)),
    }))
    .sort((a, b) => a.name.localeCompare(b.name));
  if (files.length === 0)
    return { ok: false, issues: [{ file: basename(path), message: 'folder is empty' }] };
  return { ok: true, files, issues, close: () => {} };
}
