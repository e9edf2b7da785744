import { describe, expect, it } from 'vitest';
import { LineSplitter, LineTooLongError, MAX_LINE_CHARS } from '../../../shared/bundle/line-splitter';

function splitInChunks(text: string, chunkSize: number, maxLineChars?: number): string[] {
  const lines: string[] = [];
  const splitter = new LineSplitter((line) => lines.push(line), maxLineChars);
  for (let i = 0; i < text.length; i += chunkSize) splitter.push(text.slice(i, i + chunkSize));
  splitter.end();
  return lines;
}

describe('LineSplitter', () => {
  // Reference: ECMAScript String.prototype.split on /\r?\n/, the whole text at once; a final
  // newline leaves no extra empty line (the POSIX "text file" definition of a line).
  const sample = '\uFEFFt,x\r\n0,1\n\n0.5,2\r\n1,3\nlast';
  const reference = sample.slice(1).split(/\r?\n/);

  it.each([1, 2, 3, 5, 64])('gives the same lines as String.split for chunks of %i characters', (size) => {
    expect(splitInChunks(sample, size)).toEqual(reference);
  });

  it('drops a byte-order mark only at the very start', () => {
    expect(splitInChunks('\uFEFFa\n\uFEFFb\n', 1)).toEqual(['a', '\uFEFFb']);
  });

  it('accepts a line of exactly the limit and refuses one character more, naming the line', () => {
    expect(splitInChunks(`h\n${'x'.repeat(10)}\n`, 3, 10)).toEqual(['h', 'x'.repeat(10)]);
    expect(() => splitInChunks(`h\n${'x'.repeat(11)}\n`, 3, 10)).toThrow(LineTooLongError);
    try {
      splitInChunks(`h\nok\n${'x'.repeat(11)}`, 4, 10);
    } catch (error) {
      expect((error as LineTooLongError).lineNumber).toBe(3);
      expect((error as Error).message).toMatch(/line 3 is longer than 10 characters/);
    }
  });

  it('refuses a 60-million-character line once the limit is passed, without reading it all', () => {
    // 64 KiB chunks as a file stream delivers them; the splitter must stop near MAX_LINE_CHARS.
    const chunk = 'x'.repeat(65_536);
    const splitter = new LineSplitter(() => {});
    let fed = 0;
    expect(() => {
      for (; fed < 60_000_000; fed += chunk.length) splitter.push(chunk);
    }).toThrow(/line 1 is longer than 1,000,000 characters/);
    expect(fed).toBeLessThanOrEqual(MAX_LINE_CHARS + chunk.length);
  });
});
