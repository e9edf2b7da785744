import { createHash } from 'node:crypto';
import type { Readable } from 'node:stream';
import { crc32 } from 'node:zlib';

export interface ConsumedFile {
  size: number;
  sha256: string;
  /** CRC-32 of the bytes, to compare with a zip entry's recorded checksum. */
  crc32: number;
}

export class InvalidTextError extends Error {}

/**
 * Reads a stream once: hashes every byte, lets `onBytes` veto the growing size (zip-bomb guard;
 * throw to abort) and hands UTF-8 text to `onText` chunk by chunk, so the file is never held whole.
 */
export async function consumeFileStream(
  stream: Readable,
  handlers: { onBytes?: (totalSoFar: number, chunkLength: number) => void; onText?: (text: string) => void },
): Promise<ConsumedFile> {
  const hash = createHash('sha256');
  const decoder = new TextDecoder('utf-8', { fatal: true });
  let size = 0;
  let checksum = 0;
  try {
    for await (const chunk of stream) {
      const bytes = chunk as Buffer;
      size += bytes.length;
      handlers.onBytes?.(size, bytes.length);
      hash.update(bytes);
      checksum = crc32(bytes, checksum);
      if (handlers.onText) handlers.onText(decodeChunk(decoder, bytes, false));
    }
    if (handlers.onText) handlers.onText(decodeChunk(decoder, new Uint8Array(0), true));
  } finally {
    stream.destroy();
  }
  return { size, sha256: hash.digest('hex'), crc32: checksum };
}

function decodeChunk(decoder: TextDecoder, bytes: Uint8Array, isLast: boolean): string {
  try {
    return decoder.decode(bytes, { stream: !isLast });
  } catch {
    throw new InvalidTextError('not valid UTF-8 text');
  }
}
