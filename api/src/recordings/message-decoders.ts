import { parse as parseMessageDefinition } from '@foxglove/rosmsg';
import { MessageReader as Ros1MessageReader } from '@foxglove/rosmsg-serialization';
import { MessageReader as Ros2MessageReader } from '@foxglove/rosmsg2-serialization';
import { BUILTIN_ROS2_DEFINITIONS, normaliseTypeName } from './builtin-definitions';
import { RecordingError } from './recording-error';
import type { RecordingTopic } from './recording-reader';

export interface DecoderRequest {
  file: string;
  topic: string;
  type: string;
  /** `cdr` (ROS 2) or `ros1`. */
  messageEncoding: string;
  /** Schema text as stored in the file; empty when the file has none. */
  schemaText: string;
  schemaEncoding: string;
}

/**
 * Builds the decoder of one topic from the schema the file stores, or from the built-in standard
 * definitions when it stores none. A topic of a type Driftcase does not map and with no schema
 * stays undecodable: it is listed but never read.
 */
export function createTopic(request: DecoderRequest): RecordingTopic {
  const type = normaliseTypeName(request.type);
  const fromFile = request.schemaText.trim().length > 0;
  const text = fromFile ? request.schemaText : BUILTIN_ROS2_DEFINITIONS[type];
  const schemaSource: RecordingTopic['schemaSource'] = fromFile ? 'file' : text ? 'builtin' : 'none';
  const base = { name: request.topic, type, schemaSource };
  if (!text) {
    return {
      ...base,
      decode: () => {
        throw new RecordingError(`no message definition for type ${type}`, {
          file: request.file,
          topic: request.topic,
        });
      },
    };
  }
  const isRos1 = request.messageEncoding === 'ros1' || request.schemaEncoding === 'ros1msg';
  let decodeBytes: (data: Uint8Array) => unknown;
  try {
    // A built-in definition is ROS 2 text; a ROS 1 file always carries its own definitions.
    const definitions = parseMessageDefinition(text, { ros2: !isRos1 || !fromFile });
    if (isRos1) {
      const reader = new Ros1MessageReader(definitions);
      decodeBytes = (data) => reader.readMessage(data);
    } else {
      const reader = new Ros2MessageReader(definitions);
      decodeBytes = (data) => reader.readMessage(data);
    }
  } catch (error) {
    throw new RecordingError(
      `the message definition of ${type} cannot be parsed (${(error as Error).message})`,
      {
        file: request.file,
        topic: request.topic,
      },
    );
  }
  return { ...base, decode: decodeBytes };
}
