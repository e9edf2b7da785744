import fs from 'node:fs/promises';
import path from 'node:path';
import { exportJWK, generateKeyPair, importJWK, type JWK } from 'jose';
import type { TJwkSet } from '../../../../shared/contracts/keys';
import { jwkThumbprint } from './jwk-thumbprint';

export const SIGNING_ALG = 'EdDSA';
const KEY_FILE = 'signing-key.jwk.json';
/** Public keys that signed earlier archives and signatures, kept so those still verify. */
const RETIRED_FILE = 'retired-keys.jwks.json';

export type PublicJwk = TJwkSet['keys'][number];

export interface SigningKey {
  kid: string;
  privateKey: CryptoKey;
  publicJwk: PublicJwk;
}

export interface RetiredKey extends PublicJwk {
  /** RFC 3339 time the key stopped signing. */
  retiredAt?: string;
}

async function newPrivateJwk(): Promise<JWK> {
  const { privateKey } = await generateKeyPair(SIGNING_ALG, { extractable: true });
  const fresh = await exportJWK(privateKey);
  return { ...fresh, alg: SIGNING_ALG, use: 'sig', kid: jwkThumbprint(fresh as Record<string, unknown>) };
}

function toPublicJwk(jwk: JWK): PublicJwk {
  const { d: _private, ...publicPart } = jwk;
  return { ...publicPart, kty: jwk.kty ?? 'OKP', kid: jwk.kid as string, alg: SIGNING_ALG, use: 'sig' };
}

async function writeAtomically(file: string, text: string, mode: number): Promise<void> {
  const temp = `${file}.partial`;
  await fs.writeFile(temp, text, { mode });
  await fs.rename(temp, file);
}

/**
 * Loads the server's Ed25519 signing key from `DATA_DIR/keys/`, creating it on first start. The
 * file holds the private JWK (mode 0600); `kid` is its RFC 7638 thumbprint. Two processes starting
 * at once agree because the file is created exclusively and the loser reads the winner's key.
 */
export async function loadOrCreateSigningKey(dataDir: string): Promise<SigningKey> {
  const dir = path.join(dataDir, 'keys');
  const file = path.join(dir, KEY_FILE);
  await fs.mkdir(dir, { recursive: true, mode: 0o700 });
  let jwk: JWK;
  try {
    jwk = JSON.parse(await fs.readFile(file, 'utf8')) as JWK;
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code !== 'ENOENT') {
      throw new Error(`The signing key ${file} could not be read: ${(error as Error).message}`);
    }
    jwk = await newPrivateJwk();
    try {
      await fs.writeFile(file, `${JSON.stringify(jwk, null, 2)}\n`, { flag: 'wx', mode: 0o600 });
    } catch (writeError) {
      if ((writeError as NodeJS.ErrnoException).code !== 'EEXIST') throw writeError;
      jwk = JSON.parse(await fs.readFile(file, 'utf8')) as JWK;
    }
  }
  if (!jwk.d || !jwk.kid) throw new Error(`The signing key ${file} is not a private JWK with a kid.`);
  return {
    kid: jwk.kid,
    privateKey: (await importJWK(jwk, SIGNING_ALG)) as CryptoKey,
    publicJwk: toPublicJwk(jwk),
  };
}

async function readRetiredKeys(dataDir: string): Promise<RetiredKey[]> {
  const file = path.join(dataDir, 'keys', RETIRED_FILE);
  try {
    return (JSON.parse(await fs.readFile(file, 'utf8')) as { keys: RetiredKey[] }).keys;
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code === 'ENOENT') return [];
    throw new Error(`The retired signing keys ${file} could not be read: ${(error as Error).message}`);
  }
}

/**
 * The server's signing keys: the current one (loaded once, on first use) and the retired public
 * keys. Rotation is prepared first (the new key exists only in memory) so the caller can record
 * it in the audit trail, then committed: the retired list is written before the new key replaces
 * the old one, so at no moment is a key that signed something missing from GET /api/keys.
 */
export function createSigningKeyStore(dataDir: string) {
  let loaded: Promise<SigningKey> | undefined;
  const current = () => {
    loaded ??= loadOrCreateSigningKey(dataDir).catch((error: unknown) => {
      loaded = undefined;
      throw error;
    });
    return loaded;
  };

  /** Every public key this server has signed with, current first: what GET /api/keys serves. */
  async function jwks(): Promise<TJwkSet> {
    const [key, retired] = await Promise.all([current(), readRetiredKeys(dataDir)]);
    return { keys: [key.publicJwk, ...retired.filter((k) => k.kid !== key.kid)] };
  }

  async function describe() {
    const [key, retired] = await Promise.all([current(), readRetiredKeys(dataDir)]);
    return {
      current: { kid: key.kid, thumbprint: jwkThumbprint(key.publicJwk), alg: SIGNING_ALG },
      retired: retired.map((k) => ({
        kid: k.kid,
        thumbprint: jwkThumbprint(k),
        retiredAt: k.retiredAt ?? null,
      })),
    };
  }

  async function prepareRotation() {
    const old = await current();
    const next = await newPrivateJwk();
    return {
      retiredKid: old.kid,
      newKid: next.kid as string,
      newThumbprint: jwkThumbprint(next as Record<string, unknown>),
      async commit(retiredAt: string) {
        const dir = path.join(dataDir, 'keys');
        const retired = await readRetiredKeys(dataDir);
        const keys = [{ ...old.publicJwk, retiredAt }, ...retired.filter((k) => k.kid !== old.kid)];
        await writeAtomically(path.join(dir, RETIRED_FILE), `${JSON.stringify({ keys }, null, 2)}\n`, 0o644);
        await writeAtomically(path.join(dir, KEY_FILE), `${JSON.stringify(next, null, 2)}\n`, 0o600);
        loaded = undefined;
      },
    };
  }

  return { current, jwks, describe, prepareRotation };
}

export type SigningKeyStore = ReturnType<typeof createSigningKeyStore>;
