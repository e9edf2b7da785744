/** Receives one line of a text file, without its line ending; `lineNumber` counts from 1. */
export type LineSink = (text: string, lineNumber: number) => void;

/**
 * Splits text that arrives in chunks into lines (LF or CRLF), so a large file never has to be
 * held whole. A final line without a newline is still delivered; a UTF-8 byte-order mark on
 * line 1 is dropped (spreadsheet exports add one).
 */
export class LineSplitter {
  private pending = '';
  private lineNumber = 0;

  constructor(private readonly sink: LineSink) {}

  push(chunk: string): void {
    let text = this.pending + chunk;
    if (this.lineNumber === 0 && text.charCodeAt(0) === 0xfeff) text = text.slice(1);
    let start = 0;
    for (let end = text.indexOf('\n', start); end !== -1; end = text.indexOf('\n', start)) {
      this.emit(text.slice(start, end));
      start = end + 1;
    }
    this.pending = text.slice(start);
  }

  /** Flushes the last line if the text did not end with a newline. Returns the number of lines seen. */
  end(): number {
    if (this.pending.length > 0) this.emit(this.pending);
    this.pending = '';
    return this.lineNumber;
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
