/** Receives one line of a text file, without its line ending; `lineNumber` counts from 1. */
export type LineSink = (text: string, lineNumber: number) => void;

/**
 * Longest line accepted, in characters. A bundle's widest row is a scan of a few thousand beams
 * (about 10 characters each); one million characters leaves ample room and keeps a hostile file
 * from growing one string without end.
 */
export const MAX_LINE_CHARS = 1_000_000;

/** A line longer than the limit: the file is refused at that line. */
export class LineTooLongError extends Error {
  constructor(
    readonly lineNumber: number,
    readonly limit: number,
  ) {
    super(
      `line ${lineNumber} is longer than ${limit.toLocaleString('en-US')} characters (no line ending found); the file is refused there`,
    );
    this.name = 'LineTooLongError';
  }
}

/**
 * Splits text that arrives in chunks into lines (LF or CRLF), so a large file never has to be
 * held whole. A final line without a newline is still delivered; a UTF-8 byte-order mark on
 * line 1 is dropped (spreadsheet exports add one). Each chunk is scanned once: the unfinished
 * line is kept as a list of pieces and joined only when its newline arrives, so the work is
 * linear in the input, and a line past `maxLineChars` throws `LineTooLongError`.
 */
export class LineSplitter {
  private pending: string[] = [];
  private pendingLength = 0;
  private lineNumber = 0;
  private isFirstChunk = true;

  constructor(
    private readonly sink: LineSink,
    private readonly maxLineChars = MAX_LINE_CHARS,
  ) {}

  push(chunk: string): void {
    let text = chunk;
    if (this.isFirstChunk && text.length > 0) {
      this.isFirstChunk = false;
      if (text.charCodeAt(0) === 0xfeff) text = text.slice(1);
    }
    let start = 0;
    for (let end = text.indexOf('\n'); end !== -1; end = text.indexOf('\n', start)) {
      this.keep(text, start, end);
      const line = this.pending.length === 1 ? this.pending[0] : this.pending.join('');
      this.pending = [];
      this.pendingLength = 0;
      this.emit(line);
      start = end + 1;
    }
    this.keep(text, start, text.length);
  }

  /** Flushes the last line if the text did not end with a newline. Returns the number of lines seen. */
  end(): number {
    if (this.pendingLength > 0) this.emit(this.pending.join(''));
    this.pending = [];
    this.pendingLength = 0;
    return this.lineNumber;
  }

  private keep(text: string, start: number, end: number): void {
    if (end <= start) return;
    this.pendingLength += end - start;
    if (this.pendingLength > this.maxLineChars)
      throw new LineTooLongError(this.lineNumber + 1, this.maxLineChars);
    this.pending.push(text.slice(start, end));
  }

  private emit(line: string): void {
    this.lineNumber++;
    this.sink(line.endsWith('\r') ? line.slice(0, -1) : line, this.lineNumber);
  }
}

/** Feeds a whole string to a line sink (the small-input path used by `validateBundleFiles`). */
export function feedText(text: string, sink: LineSink): number {
  const splitter = new LineSplitter(sink);
  splitter.push(text);
  return splitter.end();
}
