import fs from 'node:fs/promises';
import path from 'node:path';
import { calculateJwkThumbprint, exportJWK, generateKeyPair, importJWK, type JWK } from 'jose';
import type { TJwkSet } from '../../../../shared/contracts/keys';

export const SIGNING_ALG = 'EdDSA';
const KEY_FILE = 'signing-key.jwk.json';

export interface SigningKey {
  kid: string;
  privateKey: CryptoKey;
  publicJwk: TJwkSet['keys'][number];
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
    const { privateKey } = await generateKeyPair(SIGNING_ALG, { extractable: true });
    const fresh = await exportJWK(privateKey);
    jwk = { ...fresh, alg: SIGNING_ALG, use: 'sig', kid: await calculateJwkThumbprint(fresh) };
    try {
      await fs.writeFile(file, `${JSON.stringify(jwk, null, 2)}\n`, { flag: 'wx', mode: 0o600 });
    } catch (writeError) {
      if ((writeError as NodeJS.ErrnoException).code !== 'EEXIST') throw writeError;
      jwk = JSON.parse(await fs.readFile(file, 'utf8')) as JWK;
    }
  }
  if (!jwk.d || !jwk.kid) throw new Error(`The signing key ${file} is not a private JWK with a kid.`);
  const { d: _private, ...publicPart } = jwk;
  return {
    kid: jwk.kid,
    privateKey: (await importJWK(jwk, SIGNING_ALG)) as CryptoKey,
    publicJwk: { ...publicPart, kty: jwk.kty ?? 'OKP', kid: jwk.kid, alg: SIGNING_ALG, use: 'sig' },
  };
}

/** The public JWK set served at GET /api/keys. */
export function toJwkSet(key: SigningKey): TJwkSet {
  return { keys: [key.publicJwk] };
}

/** Loads the key once, on first use, and shares it. */
export function createSigningKeyStore(dataDir: string) {
  let loaded: Promise<SigningKey> | undefined;
  const current = () => {
    loaded ??= loadOrCreateSigningKey(dataDir).catch((error: unknown) => {
      loaded = undefined;
      throw error;
    });
    return loaded;
  };
  return { current, jwks: async () => toJwkSet(await current()) };
}

export type SigningKeyStore = ReturnType<typeof createSigningKeyStore>;
