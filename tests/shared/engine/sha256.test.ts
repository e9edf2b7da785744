import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { sha256Hex } from '../../../shared/engine/sha256';

const ascii = (text: string) => new TextEncoder().encode(text);

describe('sha256', () => {
  // NIST FIPS 180-4 examples (CSRC "Example Algorithms", SHA-256): "abc", the 448-bit message, and
  // the empty string (value from memory, also checked against Node's crypto below).
  it.each([
    ['abc', 'ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad'],
    [
      'abcdbcdecdefdefgefghfghighijhijkijkljklmklmnlmnomnopnopq',
      '248d6a61d20638b8e5c026930c3e6039a33ce45964ff2167f6ecedd419db06c1',
    ],
    ['', 'e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855'],
  ])('hashes %j to the published digest', (message, expected) => {
    expect(sha256Hex(ascii(message))).toBe(expected);
  });

  it('agrees with Node crypto for every length around the block and padding boundaries', () => {
    for (let length = 0; length < 200; length++) {
      const bytes = Uint8Array.from({ length }, (_, i) => (i * 31 + length * 7) & 0xff);
      expect(sha256Hex(bytes)).toBe(createHash('sha256').update(bytes).digest('hex'));
    }
  });

  it('agrees with Node crypto on a million "a" (NIST long-message example)', () => {
    const bytes = new Uint8Array(1_000_000).fill(0x61);
    expect(sha256Hex(bytes)).toBe('cdc76e5c9914fb9281a1c7e284d73e67f1809a48a497200e046d39ccc7112cd0');
    expect(sha256Hex(bytes)).toBe(createHash('sha256').update(bytes).digest('hex'));
  });
});
