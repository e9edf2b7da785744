import { unzipSync } from 'fflate';

/**
 * A bundle .zip as bundle file name → bytes. A zip of the bundle's folder (one top-level folder
 * holding manifest.json) is read from inside that folder, as the server does.
 */
export function unzipBundle(zip: Uint8Array): Record<string, Uint8Array> {
  const entries = unzipSync(zip, {
    filter: (file) => !file.name.endsWith('/') && !/(^|\/)__MACOSX\//.test(file.name),
  });
  const names = Object.keys(entries);
  const top = names[0]?.split('/')[0] ?? '';
  const root =
    !('manifest.json' in entries) && names.every((name) => name.startsWith(`${top}/`)) ? `${top}/` : '';
  const files: Record<string, Uint8Array> = {};
  for (const name of names) files[name.slice(root.length)] = entries[name];
  return files;
}
