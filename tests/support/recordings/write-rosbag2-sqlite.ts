import { mkdirSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import initSqlJs from 'sql.js';
import { encodeBundleMessages, TOPIC_TYPES } from './write-mcap';

/**
 * Writes a rosbag2 sqlite3 file with the tables rosbag2's sqlite3 storage plugin creates (topics
 * and messages; Humble has no message_definitions table, so the importer must use its built-in
 * definitions). SQLite is only the storage engine here; the CDR bytes come from write-mcap.ts.
 */
export async function writeRosbag2Db3(bundleFolder: string, out: string, scanLimit: number): Promise<string> {
  const SQL = await initSqlJs();
  const db = new SQL.Database();
  db.run(`CREATE TABLE schema(schema_version INTEGER PRIMARY KEY, ros_distro TEXT NOT NULL);
    CREATE TABLE topics(id INTEGER PRIMARY KEY, name TEXT NOT NULL, type TEXT NOT NULL, serialization_format TEXT NOT NULL, offered_qos_profiles TEXT NOT NULL);
    CREATE TABLE messages(id INTEGER PRIMARY KEY, topic_id INTEGER NOT NULL, timestamp INTEGER NOT NULL, data BLOB NOT NULL);
    INSERT INTO schema VALUES (3, 'humble');`);
  TOPIC_TYPES.forEach(([name, type], index) => {
    db.run('INSERT INTO topics VALUES (?, ?, ?, ?, ?)', [index + 1, name, type, 'cdr', '']);
  });
  const ids = new Map(TOPIC_TYPES.map(([name], index) => [name, index + 1]));
  const insert = db.prepare('INSERT INTO messages(topic_id, timestamp, data) VALUES (?, ?, ?)');
  for (const message of encodeBundleMessages(bundleFolder, { scanLimit })) {
    // 64-bit stamps go in as text: SQLite's INTEGER affinity stores them exactly.
    insert.run([ids.get(message.topic) as number, message.logTime.toString(), message.data]);
  }
  insert.free();
  writeFileSync(out, db.export());
  db.close();
  return out;
}

/** A rosbag2 folder: metadata.yaml naming one .db3 beside it. */
export async function writeRosbag2Folder(
  bundleFolder: string,
  folder: string,
  scanLimit: number,
): Promise<string> {
  mkdirSync(folder, { recursive: true });
  await writeRosbag2Db3(bundleFolder, path.join(folder, 'incident_0.db3'), scanLimit);
  writeFileSync(
    path.join(folder, 'metadata.yaml'),
    `rosbag2_bagfile_information:\n  version: 5\n  storage_identifier: sqlite3\n  relative_file_paths:\n    - incident_0.db3\n`,
  );
  return folder;
}
