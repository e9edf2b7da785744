import { createHash } from 'node:crypto';
import { createReadStream } from 'node:fs';

/**
 * SHA-256 (FIPS 180-4) of a file's bytes as lowercase hex, and its size in bytes, read as a stream
 * so size does not matter. The one file hasher of the server: evidence store, bundles and archives.
 */
export async function hashFile(path: string): Promise<{ sha256: string; size: number }> {
  const hash = createHash('sha256');
  let size = 0;
  for await (const chunk of createReadStream(path) as AsyncIterable<Buffer>) {
    hash.update(chunk);
    size += chunk.length;
  }
  return { sha256: hash.digest('hex'), size };
}

/** SHA-256 of a file's bytes as lowercase hex. */
export async function sha256File(path: string): Promise<string> {
  return (await hashFile(path)).sha256;
}
