import fs from 'node:fs';
import type { Response } from 'express';
import { AppError } from '../../../shared/errors';

export interface SendStoredFileOptions {
  /** Names the file in plain words for an error message ("the series of replay 42"). */
  what: string;
  /** Headers set only once the file is known to be readable. */
  headers?: Record<string, string>;
  /** Bytes sent before and after the file's own (e.g. a JSON wrapper). */
  prefix?: string;
  suffix?: string;
}

/**
 * Streams a file from DATA_DIR without ever crashing the server on a missing or unreadable one.
 * The file is opened and its first chunk read before any header is sent, so a missing file is a
 * 404 and an unreadable one a 500, both as JSON; a read error after that can only break the
 * connection (the client then sees a truncated body, never a complete-looking one).
 */
export async function sendStoredFile(res: Response, file: string, options: SendStoredFileOptions) {
  let handle: fs.promises.FileHandle;
  try {
    handle = await fs.promises.open(file, 'r');
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code;
    if (code === 'ENOENT')
      throw new AppError('not_found', `${capitalise(options.what)} is not stored on this server.`);
    throw new AppError(
      'internal',
      `${capitalise(options.what)} could not be read (${code ?? 'error'}).`,
      undefined,
      {
        cause: error,
      },
    );
  }
  const stream = handle.createReadStream();
  const chunks = stream[Symbol.asyncIterator]();
  let first: IteratorResult<Buffer>;
  try {
    first = await chunks.next();
  } catch (error) {
    stream.destroy();
    const code = (error as NodeJS.ErrnoException).code;
    throw new AppError(
      'internal',
      `${capitalise(options.what)} could not be read (${code ?? 'error'}).`,
      undefined,
      {
        cause: error,
      },
    );
  }
  for (const [name, value] of Object.entries(options.headers ?? {})) res.setHeader(name, value);
  if (options.prefix) res.write(options.prefix);
  try {
    if (!first.done) await write(res, first.value);
    for (let next = await chunks.next(); !next.done; next = await chunks.next()) await write(res, next.value);
  } catch (error) {
    stream.destroy();
    res.destroy(error as Error);
    return;
  }
  res.end(options.suffix ?? '');
}

function write(res: Response, chunk: Buffer): Promise<void> | void {
  if (res.write(chunk)) return;
  return new Promise((resolve, reject) => {
    const onDrain = () => {
      res.off('close', onClose);
      resolve();
    };
    const onClose = () => {
      res.off('drain', onDrain);
      reject(new Error('The client closed the connection.'));
    };
    res.once('drain', onDrain);
    res.once('close', onClose);
  });
}

const capitalise = (text: string) => text.charAt(0).toUpperCase() + text.slice(1);
