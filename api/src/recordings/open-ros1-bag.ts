import path from 'node:path';
import { Bag } from '@foxglove/rosbag';
import { FileReader } from '@foxglove/rosbag/node';
import Bzip2 from '@foxglove/wasm-bz2';
import decompressLz4 from '@foxglove/wasm-lz4';
import { createTopic } from './message-decoders';
import { RecordingError } from './recording-error';
import type { RecordingReader, RecordingTopic } from './recording-reader';

const toNs = (time: { sec: number; nsec: number }) => BigInt(time.sec) * 1_000_000_000n + BigInt(time.nsec);
const toTime = (ns: bigint) => ({ sec: Number(ns / 1_000_000_000n), nsec: Number(ns % 1_000_000_000n) });

/**
 * Opens a ROS 1 bag (format 2.0) through its index: chunks are read one at a time and may be
 * uncompressed, bz2 or lz4. A bag without its index (recording killed before it closed the bag)
 * cannot be read this way; the message says to run `rosbag reindex` on a copy first.
 */
export async function openRos1Bag(filePath: string): Promise<RecordingReader> {
  const file = path.basename(filePath);
  const bzip2 = await Bzip2.init();
  await decompressLz4.isLoaded;
  const fileReader = new FileReader(filePath);
  const bag = new Bag(fileReader, {
    parse: false,
    decompress: {
      bz2: (buffer, size) => bzip2.decompress(buffer, size, { small: false }),
      lz4: (buffer, size) => decompressLz4(buffer, size),
    },
  });
  try {
    await bag.open();
  } catch (error) {
    await fileReader.close();
    throw new RecordingError(
      `not a readable ROS 1 bag (${(error as Error).message}); a bag whose recording was interrupted needs \`rosbag reindex\` on a copy first`,
      { file },
    );
  }
  const topics = new Map<string, RecordingTopic>();
  const counts = new Map<string, number>();
  for (const info of bag.chunkInfos) {
    for (const { conn, count } of info.connections) {
      const topicName = bag.connections.get(conn)?.topic;
      if (topicName) counts.set(topicName, (counts.get(topicName) ?? 0) + count);
    }
  }
  for (const connection of bag.connections.values()) {
    if (topics.has(connection.topic)) continue;
    const topic = createTopic({
      file,
      topic: connection.topic,
      type: connection.type ?? '',
      messageEncoding: 'ros1',
      schemaText: connection.messageDefinition,
      schemaEncoding: 'ros1msg',
    });
    topic.messageCount = counts.get(connection.topic);
    topics.set(connection.topic, topic);
  }
  return {
    format: 'ros1-bag',
    file,
    topics,
    startNs: bag.startTime ? toNs(bag.startTime) : undefined,
    endNs: bag.endTime ? toNs(bag.endTime) : undefined,
    async *messages(options = {}) {
      const iterator = bag.messageIterator({
        topics: options.topics,
        start: options.startNs !== undefined ? toTime(options.startNs) : undefined,
      });
      for await (const event of iterator) {
        const logTimeNs = toNs(event.timestamp);
        if (options.endNs !== undefined && logTimeNs > options.endNs) return;
        yield { topic: event.topic, logTimeNs, data: event.data };
      }
    },
    breakNote: () => undefined,
    close: () => fileReader.close(),
  };
}
