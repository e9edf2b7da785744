import type { TArchiveCheck, TArchiveFileEntry } from '../contracts/archives';

/**
 * Compares the files found in an archive with the list in its manifest and returns one check per
 * listed file plus one per unlisted file. `ignored` names files that are legitimately not listed
 * (the manifest itself and its signature).
 */
export function compareWithManifest(
  listed: readonly TArchiveFileEntry[],
  found: readonly TArchiveFileEntry[],
  ignored: ReadonlySet<string>,
): TArchiveCheck[] {
  const foundByPath = new Map(found.map((entry) => [entry.path, entry]));
  const listedPaths = new Set<string>();
  const checks: TArchiveCheck[] = [];
  for (const expected of listed) {
    listedPaths.add(expected.path);
    const actual = foundByPath.get(expected.path);
    const check = (ok: boolean, message: string) =>
      checks.push({ kind: 'file', ok, file: expected.path, message });
    if (!actual) check(false, `${expected.path}: missing (listed in the manifest, not in the archive)`);
    else if (actual.size !== expected.size)
      check(false, `${expected.path}: changed (size ${actual.size} bytes, manifest says ${expected.size})`);
    else if (actual.sha256 !== expected.sha256)
      check(false, `${expected.path}: changed (SHA-256 ${actual.sha256}, manifest says ${expected.sha256})`);
    else check(true, `${expected.path}: ${expected.size} bytes, SHA-256 matches`);
  }
  for (const entry of found) {
    if (listedPaths.has(entry.path) || ignored.has(entry.path)) continue;
    checks.push({
      kind: 'file',
      ok: false,
      file: entry.path,
      message: `${entry.path}: extra file (in the archive, not listed in the manifest)`,
    });
  }
  return checks;
}
