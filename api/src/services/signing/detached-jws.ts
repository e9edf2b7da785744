import {
  base64url,
  type CompactJWSHeaderParameters,
  CompactSign,
  compactVerify,
  createLocalJWKSet,
  type JSONWebKeySet,
} from 'jose';
import { SIGNING_ALG, type SigningKey } from './signing-key';

/** Integrity-protected header of a findings signature. */
export interface SignatureHeader {
  alg: string;
  kid: string;
  typ: 'driftcase-findings+jws';
  /** E-mail of the reviewer who signed. */
  signedBy: string;
  /** RFC 3339 time of signing. */
  signedAt: string;
}

/**
 * Signs bytes as a detached compact JWS (RFC 7515 Appendix F): `header..signature`, the payload
 * being the canonical JSON that travels beside it.
 */
export async function signDetached(
  payload: Uint8Array,
  key: SigningKey,
  signer: { signedBy: string; signedAt: string },
): Promise<string> {
  const header: SignatureHeader = {
    alg: SIGNING_ALG,
    kid: key.kid,
    typ: 'driftcase-findings+jws',
    ...signer,
  };
  const jws = await new CompactSign(payload)
    .setProtectedHeader(header as unknown as CompactJWSHeaderParameters)
    .sign(key.privateKey);
  const [protectedHeader, , signature] = jws.split('.');
  return `${protectedHeader}..${signature}`;
}

export type SignatureCheck =
  | { valid: true; header: SignatureHeader }
  | { valid: false; header: Partial<SignatureHeader>; error: string };

function readHeader(jws: string): Partial<SignatureHeader> {
  try {
    return JSON.parse(
      new TextDecoder().decode(base64url.decode(jws.split('.')[0])),
    ) as Partial<SignatureHeader>;
  } catch {
    return {};
  }
}

/** Verifies a detached JWS over `payload` against a JWK set; never throws. */
export async function verifyDetached(
  jws: string,
  payload: Uint8Array,
  jwks: JSONWebKeySet,
): Promise<SignatureCheck> {
  const parts = jws.split('.');
  if (parts.length !== 3 || parts[1] !== '') {
    return { valid: false, header: {}, error: 'not a detached compact JWS (header..signature)' };
  }
  try {
    const attached = `${parts[0]}.${base64url.encode(payload)}.${parts[2]}`;
    const { protectedHeader } = await compactVerify(attached, createLocalJWKSet(jwks), {
      algorithms: [SIGNING_ALG],
    });
    return { valid: true, header: protectedHeader as unknown as SignatureHeader };
  } catch (error) {
    return { valid: false, header: readHeader(jws), error: (error as Error).message };
  }
}
