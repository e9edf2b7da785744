import type { JSONWebKeySet } from 'jose';
import { JWKS_PATH } from '../../../shared/archive/archive-layout';
import { tryJwkThumbprint } from '../services/signing/jwk-thumbprint';

/**
 * What the verifier trusts, given from outside the archive: public keys (a site's published
 * JWKS, or the server's own key store) and/or RFC 7638 thumbprints a key inside the archive must
 * have. Without one, nothing in the archive can prove who signed it: whoever edits an archive can
 * also re-sign it and swap keys/jwks.json.
 */
export interface TrustAnchor {
  keys?: JSONWebKeySet['keys'];
  thumbprints?: string[];
  /** Where the anchor came from, for messages ("--trusted-keys site-keys.json"). */
  label: string;
}

export interface ResolvedTrust {
  /** Keys signatures are checked against. */
  keys: JSONWebKeySet;
  anchored: boolean;
  /** One line for the report: which keys are trusted and why, or why none is. */
  ok: boolean;
  message: string;
}

type AnyJwk = JSONWebKeySet['keys'][number];

/** A public key only: a trusted JWKS that carries private members must not pass them on. */
function publicPart(jwk: AnyJwk): AnyJwk {
  const {
    d: _d,
    p: _p,
    q: _q,
    dp: _dp,
    dq: _dq,
    qi: _qi,
    k: _k,
    ...rest
  } = jwk as AnyJwk & Record<string, unknown>;
  return rest as AnyJwk;
}

const describeKey = (jwk: AnyJwk) =>
  `${jwk.kid ?? '(no kid)'} (thumbprint ${tryJwkThumbprint(jwk) ?? 'unknown'})`;

export function resolveTrust(
  anchor: TrustAnchor | undefined,
  archiveJwks: JSONWebKeySet | null,
): ResolvedTrust {
  const inArchive = archiveJwks?.keys ?? [];
  if (!anchor) {
    const held = inArchive.map(describeKey).join(', ') || 'none';
    return {
      keys: { keys: inArchive },
      anchored: false,
      ok: false,
      message: `signatures NOT anchored: no trusted key was given (--trusted-keys JWKS.json or --trusted-thumbprint T), so they were compared only with ${JWKS_PATH} inside the archive, which anyone who edits the archive can replace. Keys in the archive: ${held}. Compare the thumbprint with the one your site publishes, then verify again with --trusted-thumbprint.`,
    };
  }
  const trusted = (anchor.keys ?? []).map(publicPart);
  const wanted = new Set(anchor.thumbprints ?? []);
  const matched = inArchive.filter((jwk) => {
    const thumbprint = tryJwkThumbprint(jwk);
    return thumbprint !== null && wanted.has(thumbprint);
  });
  const unmatched = [...wanted].filter((t) => !matched.some((jwk) => tryJwkThumbprint(jwk) === t));
  const keys = [...trusted, ...matched.map(publicPart)];
  if (keys.length === 0) {
    return {
      keys: { keys: [] },
      anchored: true,
      ok: false,
      message: `no trusted key available: ${anchor.label} names no usable key${unmatched.length ? `, and no key in ${JWKS_PATH} has the thumbprint ${unmatched.join(', ')}` : ''}; every signature counts as unverified`,
    };
  }
  return {
    keys: { keys },
    anchored: true,
    ok: true,
    message: `signatures are checked only against trusted keys from ${anchor.label}: ${keys.map(describeKey).join(', ')}${unmatched.length ? ` (no key in ${JWKS_PATH} has the trusted thumbprint ${unmatched.join(', ')})` : ''}`,
  };
}
