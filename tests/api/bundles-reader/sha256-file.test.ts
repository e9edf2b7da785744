import { createHash } from 'node:crypto';
import { writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { sha256File } from '../../../api/src/bundles/sha256-file';
import { makeTempDir } from '../../support/bundle-fixtures';

async function hashOf(content: string | Buffer): Promise<string> {
  const path = join(await makeTempDir(), 'data.bin');
  await writeFile(path, content);
  return sha256File(path);
}

describe('sha256File', () => {
  // NIST FIPS 180-2, Appendix B.1 (one-block message "abc").
  it('matches the FIPS 180-2 example "abc"', async () => {
    expect(await hashOf('abc')).toBe('ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad');
  });

  // NIST FIPS 180-2, Appendix B.2 (448-bit, two-block message).
  it('matches the FIPS 180-2 two-block example', async () => {
    expect(await hashOf('abcdbcdecdefdefgefghfghighijhijkijkljklmklmnlmnomnopnopq')).toBe(
      '248d6a61d20638b8e5c026930c3e6039a33ce45964ff2167f6ecedd419db06c1',
    );
  });

  // NIST FIPS 180-2, Appendix B.3 (one million repetitions of "a"); spans many read chunks.
  it('matches the FIPS 180-2 one-million-"a" example', async () => {
    expect(await hashOf('a'.repeat(1_000_000))).toBe(
      'cdc76e5c9914fb9281a1c7e284d73e67f1809a48a497200e046d39ccc7112cd0',
    );
  });

  it('equals Node crypto on the bytes of a multi-chunk binary file', async () => {
    const bytes = Buffer.alloc(3 * 65536 + 17);
    for (let k = 0; k < bytes.length; k++) bytes[k] = (k * 31 + 7) & 0xff;
    expect(await hashOf(bytes)).toBe(createHash('sha256').update(bytes).digest('hex'));
  });
});
