import { once } from 'node:events';
import { createWriteStream, type WriteStream } from 'node:fs';

/** Appends lines to a file, waiting when the disk is slower than the reader so memory stays flat. */
export class LineWriter {
  readonly #stream: WriteStream;
  #pending = '';
  lines = 0;

  constructor(filePath: string, header?: string) {
    this.#stream = createWriteStream(filePath);
    if (header) this.#pending = `${header}\n`;
  }

  async write(line: string): Promise<void> {
    this.#pending += `${line}\n`;
    this.lines++;
    if (this.#pending.length > 1 << 16) await this.#flush();
  }

  async #flush(): Promise<void> {
    const chunk = this.#pending;
    this.#pending = '';
    if (!this.#stream.write(chunk)) await once(this.#stream, 'drain');
  }

  async close(): Promise<void> {
    await this.#flush();
    this.#stream.end();
    await once(this.#stream, 'finish');
  }
}
