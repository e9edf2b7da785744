import { createHash } from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { JSONWebKeySet } from 'jose';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { verifyArchive } from '../../api/src/archive/verify-archive';
import { hashFile } from '../../api/src/bundles/sha256-file';
import { archivedCase, downloadArchive, genuineArchive } from '../support/archive-samples';
import { createTestApp, type TestApp } from '../support/test-app';
import { writeZipEntries } from './rewrite-zip';
import { runVerifyArchive } from './run-verify-archive';

let t: TestApp;
let dir: string;
let good: string;
let entries: Map<string, Buffer>;
let counter = 0;

async function tampered(mutate: (copy: Map<string, Buffer>) => void): Promise<string> {
  const copy = new Map([...entries].map(([name, data]) => [name, Buffer.from(data)]));
  mutate(copy);
  return writeZipEntries(path.join(dir, `tampered-${counter++}.zip`), copy);
}

/** The server's published keys (GET /api/keys), the trust anchor a site keeps a copy of. */
let published: { keys: JSONWebKeySet['keys'] };
let publishedFile: string;
const trust = () => ({ keys: published.keys, label: 'the published keys' });
const failures = async (file: string, skipReplays = true) =>
  (await verifyArchive(file, { skipReplays, trust: trust() })).checks.filter((c) => !c.ok);

beforeAll(async () => {
  t = await createTestApp();
  ({ dir, file: good, entries, published, publishedFile } = await genuineArchive(t, 'driftcase-tamper-'));
}, 120_000);
afterAll(() => t.close());

describe('SHA-256 of archive files', () => {
  // NIST FIPS 180-2, Appendix B.1, B.2 and B.3 (one-block, multi-block and one million 'a').
  const vectors: [string, string][] = [
    ['abc', 'ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad'],
    [
      'abcdbcdecdefdefgefghfghighijhijkijkljklmklmnlmnomnopnopq',
      '248d6a61d20638b8e5c026930c3e6039a33ce45964ff2167f6ecedd419db06c1',
    ],
    ['a'.repeat(1_000_000), 'cdc76e5c9914fb9281a1c7e284d73e67f1809a48a497200e046d39ccc7112cd0'],
  ];
  it.each(vectors.map(([m, h], i) => [i, m, h]))(
    'matches NIST FIPS 180-2 example %i',
    async (i, message, expected) => {
      const file = path.join(dir, `vector-${i}.txt`);
      fs.writeFileSync(file, message as string);
      expect((await hashFile(file)).sha256).toBe(expected);
    },
  );

  it("matches Node's crypto on a multi-chunk file", async () => {
    // Larger than the 64 KiB read chunk, so the streaming path is exercised.
    const bytes = Buffer.from(Array.from({ length: 300_001 }, (_, i) => (i * 7919) % 251));
    const file = path.join(dir, 'chunks.bin');
    fs.writeFileSync(file, bytes);
    expect(await hashFile(file)).toEqual({
      sha256: createHash('sha256').update(bytes).digest('hex'),
      size: bytes.length,
    });
  });
});

describe('verify-archive finds tampering at the right file', () => {
  it('accepts the untouched archive', async () => {
    expect(await failures(good, false)).toEqual([]);
  }, 60_000);

  it('fails at each file when one byte of it is flipped', async () => {
    // An empty entry (e.g. no audit checkpoints yet) has no byte to flip.
    const names = [...entries.keys()].filter(
      (n) => n !== 'manifest.json' && n !== 'manifest.jws' && entries.get(n)!.length > 0,
    );
    expect(names.length).toBeGreaterThan(10);
    for (const name of names) {
      const file = await tampered((copy) => {
        const data = copy.get(name)!;
        data[Math.floor(data.length / 2)] ^= 0x01;
      });
      const failed = await failures(file);
      expect(
        failed.map((c) => c.file),
        name,
      ).toContain(name);
      expect(failed.find((c) => c.file === name)?.message).toMatch(/changed/);
    }
  }, 120_000);

  it('reports a deleted file as missing and an added one as extra, by name', async () => {
    const deleted = await failures(await tampered((copy) => copy.delete('fixes/fixes.json')));
    expect(deleted).toContainEqual(
      expect.objectContaining({ file: 'fixes/fixes.json', message: expect.stringMatching(/missing/) }),
    );
    const added = await failures(
      await tampered((copy) => copy.set('notes/later.txt', Buffer.from('added afterwards'))),
    );
    expect(added).toEqual([
      expect.objectContaining({ file: 'notes/later.txt', message: expect.stringMatching(/extra/) }),
    ]);
  });

  it('catches an edited manifest through its signature, even when the listed files still match', async () => {
    const failed = await failures(
      await tampered((copy) => {
        const manifest = JSON.parse(copy.get('manifest.json')!.toString('utf8'));
        manifest.exportedBy.email = 'someone-else@driftcase.example';
        copy.set('manifest.json', Buffer.from(`${JSON.stringify(manifest, null, 2)}\n`));
      }),
    );
    expect(failed).toEqual([
      expect.objectContaining({
        kind: 'signature',
        file: 'manifest.jws',
        message: expect.stringMatching(/manifest\.json/),
      }),
    ]);
  });

  it('fails the findings signature when the signed canonical text changes', async () => {
    const failed = await failures(
      await tampered((copy) => {
        const text = copy.get('findings/v1/canonical.json')!.toString('utf8');
        copy.set('findings/v1/canonical.json', Buffer.from(text.replace('wet ramp', 'dry ramp')));
      }),
    );
    expect(failed).toContainEqual(
      expect.objectContaining({ kind: 'signature', file: 'findings/v1/signatures/signoff-1.jws' }),
    );
  });

  it('reports the first broken audit entry when the chain is edited', async () => {
    const failed = await failures(
      await tampered((copy) => {
        const chain = JSON.parse(copy.get('audit/chain.json')!.toString('utf8'));
        chain[1].actorEmail = 'nobody@driftcase.example';
        copy.set('audit/chain.json', Buffer.from(JSON.stringify(chain, null, 2)));
      }),
    );
    expect(failed).toContainEqual(
      expect.objectContaining({ kind: 'audit-chain', message: expect.stringMatching(/entry 2/) }),
    );
  });

  it('re-runs a replay and fails its digest when the recorded digest is altered', async () => {
    const digestName = [...entries.keys()].find((n) => n.endsWith('/digest'))!;
    const failed = await failures(
      await tampered((copy) => copy.set(digestName, Buffer.from(`${'0'.repeat(64)}\n`))),
      false,
    );
    expect(failed).toContainEqual(
      expect.objectContaining({
        kind: 'replay',
        file: digestName,
        message: expect.stringMatching(/re-run gives digest/),
      }),
    );
  }, 60_000);
});

describe('an archive exported before engine 2.0.0 (digest layout 1)', () => {
  let old: string;
  beforeAll(async () => {
    // Exactly what an older server exported: result.json without an engine stamp and a digest of
    // layout 1 (here a stand-in value), archived and signed as usual.
    const { caseId, replayId } = await archivedCase(t);
    const resultFile = path.join(
      os.tmpdir(),
      `driftcase-test-${process.pid}`,
      'derived',
      'replays',
      replayId,
      'result.json',
    );
    const result = JSON.parse(fs.readFileSync(resultFile, 'utf8'));
    delete result.engine;
    result.digest = 'c0ffee'.padEnd(64, '0');
    fs.writeFileSync(resultFile, JSON.stringify(result));
    old = await downloadArchive(t, caseId, dir, 'old-layout.zip');
  }, 120_000);

  it('explains the digest as not comparable, not as tampering, and every other check holds', async () => {
    const report = await verifyArchive(old, { trust: trust() });
    const failed = report.checks.filter((c) => !c.ok);
    expect(failed).toHaveLength(1);
    expect(failed[0]).toMatchObject({ kind: 'replay', olderDigestLayout: 1 });
    expect(failed[0].message).toMatch(/not a sign of tampering/);
    expect(failed[0].message).toMatch(/engine 1\.x, digest layout 1/);
    expect(failed[0].message).toMatch(/computes digest layout 2/);
  }, 60_000);

  it('still fails as tampering when a digest of the current layout is altered', async () => {
    const digestName = [...entries.keys()].find((n) => n.endsWith('/digest'))!;
    const replayJson = digestName.replace(/digest$/, 'replay.json');
    expect(JSON.parse(entries.get(replayJson)!.toString('utf8')).engine.digestLayout).toBe(2);
    const failed = await failures(
      await tampered((copy) => copy.set(digestName, Buffer.from(`${'1'.repeat(64)}\n`))),
      false,
    );
    const replayCheck = failed.find((c) => c.kind === 'replay');
    expect(replayCheck?.olderDigestLayout).toBeUndefined();
    expect(replayCheck?.message).toMatch(/changed after export/);
  }, 60_000);
});

describe('npm run cli -- verify-archive', () => {
  const run = runVerifyArchive;

  it('exits 0 for an intact archive, printing one ok line per check', async () => {
    const { code, stdout } = await run(good, '--trusted-keys', publishedFile);
    expect(code).toBe(0);
    expect(stdout).toMatch(/^ok {3}manifest/m);
    expect(stdout).toMatch(/ALL \d+ CHECKS PASSED/);
  }, 60_000);

  it('exits 3 with an OLD line for a replay digest from an older engine', async () => {
    const file = [...fs.readdirSync(dir)].find((name) => name === 'old-layout.zip');
    const { code, stdout } = await run(path.join(dir, file!), '--trusted-keys', publishedFile);
    expect(code).toBe(3);
    expect(stdout).toMatch(/^OLD {2}replay +replay .*not a sign of tampering/m);
    expect(stdout).toMatch(
      /OTHER CHECKS PASSED; 1 REPLAY DIGEST FROM AN OLDER ENGINE COULD NOT BE RE-CONFIRMED/,
    );
  }, 60_000);

  it('exits 2 naming the file when one is tampered, and 2 for a missing file', async () => {
    const file = await tampered((copy) => copy.delete('report.html'));
    const { code, stdout } = await run(file, '--skip-replays');
    expect(code).toBe(2);
    expect(stdout).toMatch(/^FAIL file +report\.html: missing/m);
    expect((await run(path.join(dir, 'no-such.zip'))).code).toBe(2);
  }, 60_000);
});
