import { readdir, readFile, stat } from 'node:fs/promises';
import path from 'node:path';
import { parse as parseYaml } from 'yaml';
import { openMcap } from './open-mcap';
import { openRos1Bag } from './open-ros1-bag';
import { openRosbag2Sqlite } from './open-rosbag2-sqlite';
import { RecordingError } from './recording-error';
import type { RecordingReader } from './recording-reader';

const MCAP_MAGIC = [0x89, 0x4d, 0x43, 0x41, 0x50];
const BAG_MAGIC = '#ROSBAG V2.0';
const SQLITE_MAGIC = 'SQLite format 3\0';

/**
 * Opens SOURCE by what it holds, not by its name: an MCAP file, a ROS 1 bag, a rosbag2 sqlite3
 * file, or a rosbag2 folder (its `metadata.yaml` names the storage and the files).
 */
export async function openRecording(source: string): Promise<RecordingReader> {
  const info = await stat(source).catch(() => undefined);
  if (!info) throw new RecordingError('no such file or folder', { file: source });
  if (info.isDirectory()) return openRosbag2Folder(source);
  const kind = await sniffFile(source);
  if (kind === 'mcap') return openMcap(source);
  if (kind === 'bag') return openRos1Bag(source);
  if (kind === 'sqlite') return openRosbag2Sqlite([source]);
  throw new RecordingError(
    'not a recording Driftcase reads (expected an MCAP file, a ROS 1 bag 2.0, a rosbag2 .db3 or a rosbag2 folder)',
    { file: path.basename(source) },
  );
}

export async function sniffFile(filePath: string): Promise<'mcap' | 'bag' | 'sqlite' | 'unknown'> {
  const { open } = await import('node:fs/promises');
  const handle = await open(filePath, 'r');
  try {
    const head = Buffer.alloc(16);
    const { bytesRead } = await handle.read(head, 0, 16, 0);
    const bytes = head.subarray(0, bytesRead);
    if (MCAP_MAGIC.every((byte, i) => bytes[i] === byte)) return 'mcap';
    if (bytes.toString('latin1').startsWith(BAG_MAGIC)) return 'bag';
    if (bytes.toString('latin1') === SQLITE_MAGIC) return 'sqlite';
    return 'unknown';
  } finally {
    await handle.close();
  }
}

async function openRosbag2Folder(folder: string): Promise<RecordingReader> {
  const metadataPath = path.join(folder, 'metadata.yaml');
  const names = await readdir(folder);
  let files: string[];
  let storage: string | undefined;
  if (names.includes('metadata.yaml')) {
    let metadata: unknown;
    try {
      metadata = parseYaml(await readFile(metadataPath, 'utf8'));
    } catch (error) {
      throw new RecordingError(`not valid YAML (${(error as Error).message})`, { file: 'metadata.yaml' });
    }
    const info = (metadata as { rosbag2_bagfile_information?: Record<string, unknown> })
      ?.rosbag2_bagfile_information;
    const relative = info?.relative_file_paths;
    if (!info || !Array.isArray(relative) || relative.length === 0) {
      throw new RecordingError('rosbag2_bagfile_information.relative_file_paths is missing', {
        file: 'metadata.yaml',
      });
    }
    storage = typeof info.storage_identifier === 'string' ? info.storage_identifier : undefined;
    files = relative.map((name) => path.join(folder, path.basename(String(name))));
  } else {
    files = names
      .filter((name) => /\.(db3|mcap)$/.test(name))
      .sort()
      .map((name) => path.join(folder, name));
  }
  if (files.length === 0) {
    throw new RecordingError('the folder holds no .db3 or .mcap file and no metadata.yaml', {
      file: path.basename(folder),
    });
  }
  for (const file of files) {
    if (!(await stat(file).catch(() => undefined))) {
      throw new RecordingError('listed in metadata.yaml but missing from the folder', {
        file: path.basename(file),
      });
    }
  }
  if (storage === 'mcap' || files.every((file) => file.endsWith('.mcap'))) {
    if (files.length > 1) {
      throw new RecordingError('a split MCAP recording: import its files one at a time', {
        file: path.basename(folder),
      });
    }
    return openMcap(files[0]);
  }
  return openRosbag2Sqlite(files);
}
