import { createHash } from 'node:crypto';

/** The members RFC 7638 §3.2 hashes for each key type (OKP from RFC 8037 §2). */
const REQUIRED_MEMBERS: Record<string, readonly string[]> = {
  EC: ['crv', 'kty', 'x', 'y'],
  OKP: ['crv', 'kty', 'x'],
  RSA: ['e', 'kty', 'n'],
  oct: ['k', 'kty'],
};

/**
 * RFC 7638 JWK thumbprint (SHA-256, base64url without padding): the hash of a JSON object with
 * only the key type's required members, in lexicographic order, without whitespace. It names a
 * public key by its content, so a site can publish it out of band and a verifier can recognise
 * the key whatever `kid` an archive claims for it. Throws for a key it cannot name.
 */
export function jwkThumbprint(jwk: Record<string, unknown>): string {
  const members = REQUIRED_MEMBERS[String(jwk.kty)];
  if (!members) throw new Error(`unsupported key type ${JSON.stringify(jwk.kty)}`);
  const parts = members.map((name) => {
    const value = jwk[name];
    if (typeof value !== 'string' || value === '') throw new Error(`the key has no "${name}" member`);
    return `${JSON.stringify(name)}:${JSON.stringify(value)}`;
  });
  return createHash('sha256')
    .update(`{${parts.join(',')}}`, 'utf8')
    .digest('base64url');
}

/** The thumbprint, or null for a key that is not a well-formed JWK of a known type. */
export function tryJwkThumbprint(jwk: unknown): string | null {
  if (!jwk || typeof jwk !== 'object') return null;
  try {
    return jwkThumbprint(jwk as Record<string, unknown>);
  } catch {
    return null;
  }
}
