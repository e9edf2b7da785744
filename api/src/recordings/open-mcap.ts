import { createReadStream } from 'node:fs';
import { open } from 'node:fs/promises';
import path from 'node:path';
import { McapIndexedReader, McapStreamReader, type McapTypes } from '@mcap/core';
import { FileHandleReadable } from '@mcap/nodejs';
import { loadDecompressHandlers } from '@mcap/support';
import { createTopic } from './message-decoders';
import { formatStampNs } from './recording-error';
import type { RawRecordingMessage, RecordingReader, RecordingTopic } from './recording-reader';

type Channel = McapTypes.TypedMcapRecords['Channel'];
type Schema = McapTypes.TypedMcapRecords['Schema'];

const textDecoder = new TextDecoder();

/**
 * Opens an MCAP file. With a summary (a complete file), messages are read through the chunk
 * index, only the chunks overlapping the asked time range. Without one (a recorder that never
 * wrote it, or a file cut short by a power loss) the file is read front to back, up to the first
 * damage, which `breakNote()` then describes.
 */
export async function openMcap(filePath: string): Promise<RecordingReader> {
  const file = path.basename(filePath);
  const decompressHandlers = await loadDecompressHandlers();
  const topics = new Map<string, RecordingTopic>();
  const topicOf = (channel: Channel, schema: Schema | undefined) => {
    let topic = topics.get(channel.topic);
    if (!topic) {
      topic = createTopic({
        file,
        topic: channel.topic,
        type: schema?.name ?? channel.metadata.get('type') ?? '',
        messageEncoding: channel.messageEncoding,
        schemaText: schema ? textDecoder.decode(schema.data) : '',
        schemaEncoding: schema?.encoding ?? '',
      });
      topics.set(channel.topic, topic);
    }
    return topic;
  };

  const handle = await open(filePath, 'r');
  let indexed: McapIndexedReader | undefined;
  try {
    indexed = await McapIndexedReader.Initialize({
      readable: new FileHandleReadable(handle),
      decompressHandlers,
    });
    if (indexed.chunkIndexes.length === 0 && (indexed.statistics?.messageCount ?? 0n) > 0n)
      indexed = undefined;
  } catch {
    indexed = undefined;
  }
  if (indexed) {
    const reader = indexed;
    for (const channel of reader.channelsById.values()) {
      const topic = topicOf(channel, reader.schemasById.get(channel.schemaId));
      const count = reader.statistics?.channelMessageCounts.get(channel.id);
      if (count !== undefined) topic.messageCount = Number(count);
    }
    return {
      format: 'mcap',
      file,
      topics,
      startNs: reader.statistics?.messageStartTime,
      endNs: reader.statistics?.messageEndTime,
      async *messages(options = {}) {
        for await (const message of reader.readMessages({
          topics: options.topics,
          startTime: options.startNs,
          endTime: options.endNs,
        })) {
          const channel = reader.channelsById.get(message.channelId);
          if (!channel) continue;
          yield { topic: channel.topic, logTimeNs: message.logTime, data: message.data };
        }
      },
      breakNote: () => undefined,
      close: () => handle.close(),
    };
  }
  await handle.close();
  let breakNote: string | undefined;
  return {
    format: 'mcap',
    file,
    topics,
    messages(options = {}) {
      return streamMessages(filePath, file, decompressHandlers, topicOf, options, (note) => {
        breakNote = note;
      });
    },
    breakNote: () => breakNote,
    close: async () => {},
  };
}

async function* streamMessages(
  filePath: string,
  file: string,
  decompressHandlers: McapTypes.DecompressHandlers,
  topicOf: (channel: Channel, schema: Schema | undefined) => RecordingTopic,
  options: { topics?: string[]; startNs?: bigint; endNs?: bigint },
  onBreak: (note: string | undefined) => void,
): AsyncGenerator<RawRecordingMessage> {
  const reader = new McapStreamReader({ decompressHandlers });
  const schemas = new Map<number, Schema>();
  const channels = new Map<number, Channel>();
  const wanted = options.topics ? new Set(options.topics) : undefined;
  let bytesIn = 0;
  let lastLogTime: bigint | undefined;
  let messageCount = 0;
  const describeBreak = (reason: string) =>
    `${file}: reading stopped at byte ${bytesIn - reader.bytesRemaining()} of ${bytesIn}: ${reason}; ` +
    `${messageCount} messages were read${lastLogTime !== undefined ? `, the last at log time ${formatStampNs(lastLogTime)}` : ''}`;
  onBreak(undefined);
  for await (const piece of createReadStream(filePath, { highWaterMark: 1 << 20 })) {
    bytesIn += (piece as Buffer).length;
    reader.append(piece as Buffer);
    for (;;) {
      let record: McapTypes.TypedMcapRecord | undefined;
      try {
        record = reader.nextRecord();
      } catch (error) {
        onBreak(describeBreak(`damaged record (${(error as Error).message})`));
        return;
      }
      if (!record) break;
      if (record.type === 'Schema') schemas.set(record.id, record);
      else if (record.type === 'Channel') {
        channels.set(record.id, record);
        topicOf(record, schemas.get(record.schemaId));
      } else if (record.type === 'Message') {
        const channel = channels.get(record.channelId);
        if (!channel) continue;
        messageCount++;
        lastLogTime = record.logTime;
        if (wanted && !wanted.has(channel.topic)) continue;
        if (options.startNs !== undefined && record.logTime < options.startNs) continue;
        if (options.endNs !== undefined && record.logTime > options.endNs) continue;
        yield { topic: channel.topic, logTimeNs: record.logTime, data: record.data };
      }
    }
  }
  if (!reader.done()) {
    onBreak(
      describeBreak(
        reader.bytesRemaining() > 0
          ? 'the file ends inside a record (cut short)'
          : 'the file ends without its footer (cut short)',
      ),
    );
  }
}
