/**
 * Offset of the first JSON syntax error in `text` (RFC 8259 grammar), or undefined when it parses.
 * V8's JSON.parse does not always say where it failed ("Unexpected token '}'"), and a person
 * fixing a manifest by hand needs the line.
 */
export function findJsonErrorOffset(text: string): number | undefined {
  let index = 0;
  const fail = (): never => {
    throw index;
  };
  const skipSpace = () => {
    while (index < text.length && ' \t\n\r'.includes(text[index])) index++;
  };
  const expectWord = (word: string) => {
    if (text.startsWith(word, index)) index += word.length;
    else fail();
  };
  const readString = () => {
    index++;
    while (index < text.length && text[index] !== '"') {
      if (text.charCodeAt(index) < 0x20) fail();
      index += text[index] === '\\' ? 2 : 1;
    }
    if (index >= text.length) fail();
    index++;
  };
  const readNumber = () => {
    const match = /^-?(0|[1-9]\d*)(\.\d+)?([eE][+-]?\d+)?/.exec(text.slice(index, index + 400));
    if (!match || match[0].length === 0) fail();
    index += match![0].length;
  };
  const readList = (close: string, readItem: () => void) => {
    index++;
    skipSpace();
    if (text[index] === close) {
      index++;
      return;
    }
    for (;;) {
      readItem();
      skipSpace();
      if (text[index] === close) {
        index++;
        return;
      }
      if (text[index] !== ',') fail();
      index++;
    }
  };
  const readValue = (): void => {
    skipSpace();
    const char = text[index];
    if (char === '{') {
      readList('}', () => {
        skipSpace();
        if (text[index] !== '"') fail();
        readString();
        skipSpace();
        if (text[index] !== ':') fail();
        index++;
        readValue();
      });
    } else if (char === '[') readList(']', readValue);
    else if (char === '"') readString();
    else if (char === 't') expectWord('true');
    else if (char === 'f') expectWord('false');
    else if (char === 'n') expectWord('null');
    else readNumber();
  };
  try {
    readValue();
    skipSpace();
    return index < text.length ? index : undefined;
  } catch (offset) {
    return Math.min(offset as number, text.length);
  }
}
