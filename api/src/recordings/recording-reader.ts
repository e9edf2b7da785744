/** One serialized message as the container holds it; decoded only when a mapping needs it. */
export interface RawRecordingMessage {
  topic: string;
  /** When the recorder received it (ns since the Unix epoch). */
  logTimeNs: bigint;
  data: Uint8Array;
}

export interface RecordingTopic {
  name: string;
  /** Normalised type name, e.g. `sensor_msgs/LaserScan`. */
  type: string;
  messageCount?: number;
  /** Turns the serialized bytes into a plain object (ROS 1 or ROS 2 field names). */
  decode(data: Uint8Array): unknown;
  /** Where the schema came from: the file itself or Driftcase's built-in definitions. */
  schemaSource: 'file' | 'builtin' | 'none';
}

export type RecordingFormat = 'mcap' | 'ros1-bag' | 'rosbag2-sqlite3';

/**
 * A recording opened for reading. `messages()` may be called more than once (the importer reads
 * twice: once to find topics, frames and the first messages, once to write the tables); each call
 * streams from the file again, so memory does not grow with the recording.
 */
export interface RecordingReader {
  format: RecordingFormat;
  /** File the messages come from (shown in messages). */
  file: string;
  topics: Map<string, RecordingTopic>;
  /** First and last log times when the file's index says so. */
  startNs?: bigint;
  endNs?: bigint;
  messages(options?: {
    topics?: string[];
    startNs?: bigint;
    endNs?: bigint;
  }): AsyncIterable<RawRecordingMessage>;
  /** Set when a read stopped at damage (a file cut short): where and why. */
  breakNote(): string | undefined;
  close(): Promise<void>;
}
