import { readFile, stat } from 'node:fs/promises';
import path from 'node:path';
import initSqlJs, { type Database } from 'sql.js';
import { createTopic } from './message-decoders';
import { RecordingError } from './recording-error';
import type { RecordingReader, RecordingTopic } from './recording-reader';

/**
 * SQLite in WebAssembly reads a database from memory, so a `.db3` is loaded whole; rosbag2
 * splits sqlite3 recordings into files of a configured size, which keeps each one small. Larger
 * files are refused with a message rather than exhausting memory.
 */
export const MAX_DB3_BYTES = 2 * 1024 ** 3;

const toNs = (sec: number, nsec: number) => BigInt(sec) * 1_000_000_000n + BigInt(nsec);

/** Opens one or more rosbag2 sqlite3 files (the split files of one recording, in order). */
export async function openRosbag2Sqlite(filePaths: string[]): Promise<RecordingReader> {
  const SQL = await initSqlJs();
  const databases: { file: string; db: Database; topicNames: Map<number, string> }[] = [];
  const topics = new Map<string, RecordingTopic>();
  let startNs: bigint | undefined;
  let endNs: bigint | undefined;
  try {
    for (const filePath of filePaths) {
      const file = path.basename(filePath);
      const { size } = await stat(filePath);
      if (size > MAX_DB3_BYTES) {
        throw new RecordingError(
          `${(size / 1024 ** 3).toFixed(1)} GiB is more than the 2 GiB a single .db3 may hold here; split it (ros2 bag convert) or convert it to MCAP`,
          { file },
        );
      }
      let db: Database;
      try {
        db = new SQL.Database(await readFile(filePath));
        db.exec('SELECT count(*) FROM messages');
      } catch (error) {
        throw new RecordingError(`not a rosbag2 sqlite3 file (${(error as Error).message})`, { file });
      }
      const definitions = readDefinitions(db);
      const topicNames = new Map<number, string>();
      const rows = db.exec('SELECT id, name, type, serialization_format FROM topics')[0]?.values ?? [];
      for (const [id, name, type, serialization] of rows as [number, string, string, string][]) {
        topicNames.set(id, name);
        if (topics.has(name)) continue;
        const definition = definitions.get(type);
        topics.set(
          name,
          createTopic({
            file,
            topic: name,
            type,
            messageEncoding: serialization,
            schemaText: definition?.encoding === 'ros2msg' ? definition.text : '',
            schemaEncoding: definition?.encoding ?? '',
          }),
        );
      }
      const span = db.exec(
        'SELECT min(timestamp) / 1000000000, min(timestamp) % 1000000000, max(timestamp) / 1000000000, max(timestamp) % 1000000000 FROM messages',
      )[0]?.values[0] as (number | null)[] | undefined;
      if (span && span[0] !== null) {
        const first = toNs(span[0] as number, span[1] as number);
        const last = toNs(span[2] as number, span[3] as number);
        if (startNs === undefined || first < startNs) startNs = first;
        if (endNs === undefined || last > endNs) endNs = last;
      }
      databases.push({ file, db, topicNames });
    }
  } catch (error) {
    for (const { db } of databases) db.close();
    throw error;
  }
  return {
    format: 'rosbag2-sqlite3',
    file: databases.map(({ file }) => file).join(', '),
    topics,
    startNs,
    endNs,
    async *messages(options = {}) {
      for (const { db, topicNames } of databases) {
        const statement = db.prepare(
          'SELECT topic_id, timestamp / 1000000000, timestamp % 1000000000, data FROM messages ORDER BY timestamp, id',
        );
        try {
          while (statement.step()) {
            const [topicId, sec, nsec, data] = statement.get() as [number, number, number, Uint8Array];
            const topic = topicNames.get(topicId);
            if (!topic || (options.topics && !options.topics.includes(topic))) continue;
            const logTimeNs = toNs(sec, nsec);
            if (options.startNs !== undefined && logTimeNs < options.startNs) continue;
            if (options.endNs !== undefined && logTimeNs > options.endNs) break;
            yield { topic, logTimeNs, data };
          }
        } finally {
          statement.free();
        }
      }
    },
    breakNote: () => undefined,
    close: async () => {
      for (const { db } of databases) db.close();
    },
  };
}

/** rosbag2 from Iron on stores each type's definition; older files have no such table. */
function readDefinitions(db: Database): Map<string, { encoding: string; text: string }> {
  const definitions = new Map<string, { encoding: string; text: string }>();
  const hasTable = db.exec(
    "SELECT name FROM sqlite_master WHERE type = 'table' AND name = 'message_definitions'",
  );
  if (!hasTable[0]) return definitions;
  const rows = db.exec('SELECT topic_type, encoding, encoded_message_definition FROM message_definitions')[0];
  for (const [type, encoding, text] of (rows?.values ?? []) as [string, string, string][]) {
    definitions.set(type, { encoding, text });
  }
  return definitions;
}
