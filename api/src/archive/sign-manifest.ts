import { CompactSign } from 'jose';
import { SIGNING_ALG, type SigningKey } from '../services/signing/signing-key';

/**
 * Signs the exact bytes of manifest.json as a detached compact JWS (RFC 7515 Appendix F), so an
 * edited manifest is caught even when every file it lists still matches.
 */
export async function signManifest(
  manifestBytes: Uint8Array,
  key: SigningKey,
  signer: { signedBy: string; signedAt: string },
): Promise<string> {
  const jws = await new CompactSign(manifestBytes)
    .setProtectedHeader({ alg: SIGNING_ALG, kid: key.kid, typ: 'driftcase-archive-manifest+jws', ...signer })
    .sign(key.privateKey);
  const [header, , signature] = jws.split('.');
  return `${header}..${signature}`;
}
