import path from 'node:path';
import { calculateJwkThumbprint, type JSONWebKeySet } from 'jose';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { type VerifyOptions, verificationOutcome, verifyArchive } from '../../api/src/archive/verify-archive';
import { jwkThumbprint } from '../../api/src/services/signing/jwk-thumbprint';
import { type AuditChainEntry, computeAuditEntryHash, GENESIS_HASH } from '../../shared/audit-chain';
import { genuineArchive } from '../support/archive-samples';
import { createTestApp, type TestApp } from '../support/test-app';
import { forgeArchive } from './forge-archive';
import { writeZipEntries } from './rewrite-zip';
import { runVerifyArchive } from './run-verify-archive';

let t: TestApp;
let dir: string;
let good: string;
let entries: Map<string, Buffer>;
/** The server's published keys, fetched as a site would keep a copy: GET /api/keys. */
let published: JSONWebKeySet;
let publishedFile: string;
let counter = 0;

const trusted = (): VerifyOptions => ({
  skipReplays: true,
  trust: { keys: published.keys, label: 'the published keys' },
});
const write = (copy: Map<string, Buffer>) => writeZipEntries(path.join(dir, `forged-${counter++}.zip`), copy);
const readChain = (copy: Map<string, Buffer>): AuditChainEntry[] =>
  JSON.parse(copy.get('audit/chain.json')!.toString('utf8'));
const setChain = (copy: Map<string, Buffer>, chain: AuditChainEntry[]) =>
  copy.set('audit/chain.json', Buffer.from(JSON.stringify(chain, null, 2)));

/** Re-numbers and re-hashes a chain after entries were taken out, as an insider with the formula would. */
function rechain(chain: AuditChainEntry[]): AuditChainEntry[] {
  let prev = GENESIS_HASH;
  return chain.map((entry, index) => {
    const unhashed = { ...entry, chainSeq: index + 1, prevHash: prev };
    delete (unhashed as Partial<AuditChainEntry>).entryHash;
    const entryHash = computeAuditEntryHash(unhashed);
    prev = entryHash;
    return { ...unhashed, entryHash };
  });
}

const FORGERIES: [string, (copy: Map<string, Buffer>) => void][] = [
  [
    'signed findings edited to blame the operator',
    (copy) => {
      const text = copy.get('findings/v1/canonical.json')!.toString('utf8');
      copy.set(
        'findings/v1/canonical.json',
        Buffer.from(text.replace('wet ramp', 'ramp; the operator was at fault')),
      );
    },
  ],
  ['audit chain truncated', (copy) => setChain(copy, readChain(copy).slice(0, -2))],
  [
    'one audit entry removed and the rest re-chained',
    (copy) => setChain(copy, rechain(readChain(copy).filter((_, index) => index !== 2))),
  ],
  [
    'a signed findings version dropped',
    (copy) => {
      for (const name of [...copy.keys()]) if (name.startsWith('findings/v1/')) copy.delete(name);
    },
  ],
];

beforeAll(async () => {
  t = await createTestApp();
  ({ dir, file: good, entries, published, publishedFile } = await genuineArchive(t, 'driftcase-forged-'));
}, 180_000);
afterAll(() => t.close());

describe('RFC 7638 JWK thumbprint', () => {
  it('gives the RFC 7638 §3.1 example value', () => {
    // RFC 7638 section 3.1: this RSA key's SHA-256 thumbprint is NzbLsXh8uDCcd-6MNwXF4W_7noWXFZAfHkxZsRGC9Xs.
    const key = {
      kty: 'RSA',
      n: '0vx7agoebGcQSuuPiLJXZptN9nndrQmbXEps2aiAFbWhM78LhWx4cbbfAAtVT86zwu1RK7aPFFxuhDR1L6tSoc_BJECPebWKRXjBZCiFV4n3oknjhMstn64tZ_2W-5JsGY4Hc5n9yBXArwl93lqt7_RN5w6Cf0h4QyQ5v-65YGjQR0_FDW2QvzqY368QQMicAtaSqzs8KJZgnYb9c7d0zgdAZHzu6qMQvRL5hajrn1n91CbOpbISD08qNLyrdkt-bFTWhAI4vMQFh6WeZu0fM4lFd2NcRwr3XPksINHaQ-G_xBniIqbw0Ls1jF44-csFCur-kEgU8awapJzKnqDKgw',
      e: 'AQAB',
      alg: 'RS256',
      kid: '2011-04-29',
    };
    expect(jwkThumbprint(key)).toBe('NzbLsXh8uDCcd-6MNwXF4W_7noWXFZAfHkxZsRGC9Xs');
  });

  it("agrees with jose's calculateJwkThumbprint for the server's Ed25519 key, and is its kid", async () => {
    const key = published.keys[0];
    expect(jwkThumbprint(key as Record<string, unknown>)).toBe(await calculateJwkThumbprint(key));
    expect(key.kid).toBe(await calculateJwkThumbprint(key));
  });
});

describe('the genuine archive', () => {
  it('passes every check against the published keys and against the published thumbprint', async () => {
    const byKeys = await verifyArchive(good, trusted());
    expect(byKeys.checks.filter((c) => !c.ok)).toEqual([]);
    expect(byKeys.signaturesAnchored).toBe(true);
    const thumbprint = await calculateJwkThumbprint(published.keys[0]);
    const byThumbprint = await verifyArchive(good, {
      skipReplays: true,
      trust: { thumbprints: [thumbprint], label: 'the published thumbprint' },
    });
    expect(verificationOutcome(byThumbprint)).toBe(0);
  }, 60_000);

  it('without a trust anchor says the signatures are not anchored, and never passes', async () => {
    const result = await verifyArchive(good, { skipReplays: true });
    expect(result.ok).toBe(false);
    expect(result.signaturesAnchored).toBe(false);
    expect(verificationOutcome(result)).toBe(3);
    expect(result.checks).toContainEqual(
      expect.objectContaining({
        kind: 'trust',
        unanchored: true,
        message: expect.stringMatching(/NOT anchored/),
      }),
    );
    expect(result.checks.filter((c) => !c.ok && !c.unanchored)).toEqual([]);
  }, 60_000);
});

describe.each(FORGERIES)(
  'a forged archive: %s, re-signed with an attacker key under the real kid',
  (_name, edit) => {
    let forged: string;
    beforeAll(async () => {
      forged = await write(await forgeArchive(entries, (copy) => edit(copy)));
    });

    it('is refused against the published keys: the manifest signature does not verify', async () => {
      const result = await verifyArchive(forged, trusted());
      expect(result.ok).toBe(false);
      expect(verificationOutcome(result)).toBe(2);
      expect(result.checks).toContainEqual(
        expect.objectContaining({
          kind: 'signature',
          ok: false,
          file: 'manifest.jws',
          message: expect.stringMatching(/does NOT verify/),
        }),
      );
    }, 60_000);

    it('is refused against the published thumbprint', async () => {
      const result = await verifyArchive(forged, {
        skipReplays: true,
        trust: { thumbprints: [await calculateJwkThumbprint(published.keys[0])], label: 'the thumbprint' },
      });
      expect(verificationOutcome(result)).toBe(2);
    }, 60_000);

    it('is refused by POST /api/archives/verify, which trusts only the server key store', async () => {
      const res = await request(t.app)
        .post('/api/archives/verify')
        .set('Authorization', `Bearer ${await t.tokenFor('legal')}`)
        .attach('archive', forged)
        .expect(200);
      expect(res.body.ok).toBe(false);
      expect(res.body.signaturesAnchored).toBe(true);
      expect(res.body.checks).toContainEqual(expect.objectContaining({ file: 'manifest.jws', ok: false }));
    }, 60_000);

    it('without a trust anchor is never reported as passing', async () => {
      const result = await verifyArchive(forged, { skipReplays: true });
      expect(result.ok).toBe(false);
      expect(verificationOutcome(result)).not.toBe(0);
    }, 60_000);
  },
);

describe('pins in the signed manifest', () => {
  it.each(FORGERIES.slice(1))(
    'name the tamper even before the signature: %s',
    async (_name, edit) => {
      // The forger rewrote file hashes but left the manifest's pinned chain head and versions.
      const forged = await write(await forgeArchive(entries, (copy) => edit(copy), { updatePins: false }));
      const failed = (await verifyArchive(forged, { skipReplays: true })).checks.filter(
        (c) => !c.ok && !c.unanchored,
      );
      expect(failed.map((c) => c.message).join('\n')).toMatch(/signed manifest pins/);
    },
    60_000,
  );
});

describe('npm run cli -- verify-archive with a trust anchor', () => {
  const run = runVerifyArchive;

  it('exits 0 for the genuine archive with --trusted-keys, 2 for a forgery, 3 for a forgery without an anchor', async () => {
    const forged = await write(await forgeArchive(entries, FORGERIES[0][1]));
    const genuine = await run(good, '--skip-replays', '--trusted-keys', publishedFile);
    expect(genuine.code).toBe(0);
    expect(genuine.stdout).toMatch(/ALL \d+ CHECKS PASSED/);
    const refused = await run(
      forged,
      '--skip-replays',
      '--trusted-thumbprint',
      await calculateJwkThumbprint(published.keys[0]),
    );
    expect(refused.code).toBe(2);
    expect(refused.stdout).toMatch(
      /^FAIL signature +manifest\.jws: signature over manifest\.json does NOT verify/m,
    );
    const unanchored = await run(forged, '--skip-replays');
    expect(unanchored.code).toBe(3);
    expect(unanchored.stdout).not.toMatch(/ALL \d+ CHECKS PASSED/);
    expect(unanchored.stdout).toMatch(/SIGNATURES NOT ANCHORED/);
    expect(unanchored.stdout).toMatch(/^WARN trust/m);
  }, 180_000);

  it('refuses a malformed thumbprint as a usage error (exit 2)', async () => {
    expect((await run(good, '--trusted-thumbprint', 'abc')).code).toBe(2);
  }, 60_000);
});
