/**
 * Why a zip entry name would leave the bundle root, or undefined when it is safe. The checks run on
 * the raw name (backslashes kept) because Windows tools treat `\` as a separator, so `..\x` and
 * `C:\x` escape there even though they look like plain names elsewhere.
 */
export function findUnsafeEntryPath(name: string): string | undefined {
  if (name.length === 0) return 'empty entry name';
  if (name.includes('\0')) return 'entry name contains a NUL character';
  if (name.includes('\\')) return 'entry name contains a backslash (a path separator on Windows)';
  if (name.startsWith('/')) return 'absolute path';
  if (/^[A-Za-z]:/.test(name)) return 'path starts with a drive letter';
  if (name.split('/').includes('..')) return 'path leaves the bundle root ("..")';
  return undefined;
}
