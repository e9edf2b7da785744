import { describe, expect, it } from 'vitest';
import { isSafeText, printableText, safeText, unsafeTextReason } from '../../../shared/contracts/safe-text';

/**
 * Oracle independent of the code under test: UTF-8 (RFC 3629 section 3) cannot encode surrogate
 * code points, so the WHATWG TextEncoder replaces a lone one with U+FFFD and the text does not
 * survive a round trip; a proper pair does. NUL is refused because PostgreSQL text and jsonb
 * cannot hold it (PostgreSQL manual, "Character Types": the character with code zero cannot be stored).
 */
const survivesUtf8 = (text: string) => new TextDecoder().decode(new TextEncoder().encode(text)) === text;

const SAMPLES = [
  'plain text',
  'dock 4 \u{1F69A} truck', // a pair: U+1F69A as D83D DE9A
  'lone high \ud83d end',
  'lone low \ude9a end',
  'reversed \ude9a\ud83d pair',
  'high at the end \ud800',
  '\udc00 low at the start',
  'tab\tand newline\n are fine',
  'NUL \u0000 inside',
  '',
];

describe('safe text', () => {
  it('refuses exactly the texts UTF-8 cannot carry, plus NUL', () => {
    for (const text of SAMPLES) {
      expect(isSafeText(text), JSON.stringify(text)).toBe(survivesUtf8(text) && !text.includes('\u0000'));
    }
  });

  it('says what and where in plain words', () => {
    expect(unsafeTextReason('ab\u0000')).toBe(
      'must not contain the NUL character (U+0000); found at character 3',
    );
    expect(unsafeTextReason('x\ud800y')).toContain('lone UTF-16 surrogate (U+D800)');
    expect(unsafeTextReason('x\ud800y')).toContain('character 2');
  });

  it('works as a zod string that still chains trim and length checks', () => {
    const schema = safeText().trim().min(2).max(5);
    expect(schema.parse('  ok ')).toBe('ok');
    expect(schema.safeParse('o\u0000k').error?.issues[0].message).toMatch(/^Text must not contain the NUL/);
    expect(schema.safeParse('toolong').success).toBe(false);
  });

  it('writes unprintable characters as \\u escapes', () => {
    expect(printableText('a\u0000b\ud800c\u{1F69A}')).toBe('a\\u0000b\\ud800c\u{1F69A}');
    expect(isSafeText(printableText('\u0000\udfff'))).toBe(true);
  });
});
