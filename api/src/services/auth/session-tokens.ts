import { createHmac } from 'node:crypto';
import { jwtVerify, SignJWT } from 'jose';

const ISSUER = 'driftcase';
const AUDIENCE = 'driftcase-api';

export interface SessionClaims {
  userId: string;
  sessionId: string;
  /** Seconds since the epoch when this token was issued. */
  issuedAt: number;
}

/** Signs a short-lived session token (HS256 JWT) naming the user and the server-side session. */
export async function signSessionToken(
  key: Uint8Array,
  userId: string,
  sessionId: string,
  ttlSeconds: number,
) {
  return new SignJWT({ sid: sessionId })
    .setProtectedHeader({ alg: 'HS256', typ: 'JWT' })
    .setSubject(userId)
    .setIssuer(ISSUER)
    .setAudience(AUDIENCE)
    .setIssuedAt()
    .setExpirationTime(`${ttlSeconds}s`)
    .sign(key);
}

/** Returns the claims of a valid, unexpired token, or null for anything else. */
export async function readSessionToken(key: Uint8Array, token: string): Promise<SessionClaims | null> {
  try {
    const { payload } = await jwtVerify(token, key, {
      issuer: ISSUER,
      audience: AUDIENCE,
      algorithms: ['HS256'],
    });
    if (
      typeof payload.sub !== 'string' ||
      typeof payload.sid !== 'string' ||
      typeof payload.iat !== 'number'
    ) {
      return null;
    }
    return { userId: payload.sub, sessionId: payload.sid, issuedAt: payload.iat };
  } catch {
    return null;
  }
}

/**
 * The CSRF token is bound to the session (an HMAC of its id), so a double-submitted value cannot be
 * planted by another site and needs no storage.
 */
export function csrfTokenFor(key: Uint8Array, sessionId: string): string {
  return createHmac('sha256', key).update(`csrf:${sessionId}`).digest('base64url');
}
