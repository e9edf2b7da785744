import type { RecordingFileRole, RecordingFiles } from '../api/upload-recording';

const BY_EXTENSION: Record<string, RecordingFileRole> = {
  mcap: 'recording',
  bag: 'recording',
  db3: 'recording',
  pgm: 'map_image',
  png: 'map_image',
  bmp: 'map_image',
  json: 'robot',
};

/** A map_server map description names its image (`image: map.pgm`); a parameter file does not. */
const MAP_IMAGE_KEY = /^\s*image\s*:/m;

const extensionOf = (name: string) => /\.([A-Za-z0-9]+)$/.exec(name)?.[1]?.toLowerCase() ?? '';

/**
 * Sorts files dropped together onto the recording's fields: by extension, and a YAML file by
 * what it holds (a map description or a parameter file). Files that fit no field are returned
 * by name, so the page can say so instead of sending them.
 */
export async function sortRecordingFiles(
  dropped: readonly File[],
): Promise<{ files: RecordingFiles; unrecognised: string[] }> {
  const files: RecordingFiles = {};
  const unrecognised: string[] = [];
  for (const file of dropped) {
    const extension = extensionOf(file.name);
    let role: RecordingFileRole | undefined = BY_EXTENSION[extension];
    if (extension === 'yaml' || extension === 'yml') {
      role = MAP_IMAGE_KEY.test(await file.text()) ? 'map' : 'params';
    }
    if (role && !files[role]) files[role] = file;
    else unrecognised.push(file.name);
  }
  return { files, unrecognised };
}
