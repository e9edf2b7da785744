import { randomUUID } from 'node:crypto';
import { and, eq, gt, isNull } from 'drizzle-orm';
import type { TLoginRequest, TSessionUser } from '../../../../shared/contracts/auth';
import { AppError } from '../../../../shared/errors';
import type { Database, Transaction } from '../../db/client';
import { sessions, users } from '../../db/schema';
import type { Actor } from '../actor';
import type { AuditService } from '../audit/audit-service';
import type { PasswordHashing } from './password-hashing';
import { loadOrCreateSecret } from './server-secret';
import { csrfTokenFor, readSessionToken, signSessionToken } from './session-tokens';
import type { SessionUser } from './session-user';
import type { SignInThrottle } from './sign-in-throttle';

export interface AuthServiceOptions {
  db: Database;
  audit: AuditService;
  hashing: PasswordHashing;
  throttle: SignInThrottle;
  sessionTtlSeconds: number;
  sessionMaxAgeSeconds: number;
}

/** Where a sign-in comes from: the client address (after trusted proxies) and its browser. */
export interface SignInOrigin {
  address: string;
  userAgent?: string;
}

export interface IssuedSession {
  user: TSessionUser;
  token: string;
  csrfToken: string;
}

export interface AuthenticatedSession {
  user: SessionUser;
  csrfToken: string;
  /** A fresh token when the presented one is past a third of its life; the caller re-sets the cookie. */
  rotatedToken?: string;
}

const GENERIC_LOGIN_FAILURE = 'E-mail or password is not correct.';

export function createAuthService({
  db,
  audit,
  hashing,
  throttle,
  sessionTtlSeconds,
  sessionMaxAgeSeconds,
}: AuthServiceOptions) {
  let keyPromise: Promise<Buffer> | undefined;
  const sessionKey = () => {
    keyPromise ??= loadOrCreateSecret(db, 'session-token-key');
    return keyPromise;
  };
  // Checked against unknown e-mails so a wrong address takes as long as a wrong password.
  let decoyHash: Promise<string> | undefined;

  async function logIn(request: TLoginRequest, origin: SignInOrigin): Promise<IssuedSession> {
    const attempt = { email: request.email, address: origin.address };
    // Counted before the password is checked, so a locked account or address costs no hashing.
    await throttle.admit(attempt);
    const [row] = await db.select().from(users).where(eq(users.email, request.email));
    decoyHash ??= hashing.hash('decoy-password-for-timing');
    const isMatch = await hashing.verify(request.password, row?.passwordHash ?? (await decoyHash));
    if (!row || !isMatch || !row.active) throw new AppError('invalid_credentials', GENERIC_LOGIN_FAILURE);
    await throttle.succeeded(attempt);
    const userAgent = origin.userAgent;
    const sessionId = randomUUID();
    const key = await sessionKey();
    await db.transaction(async (tx) => {
      await tx.insert(sessions).values({
        id: sessionId,
        userId: row.id,
        expiresAt: new Date(Date.now() + sessionMaxAgeSeconds * 1000),
        userAgent: userAgent?.slice(0, 300),
      });
      await audit.append(tx, {
        actor: row,
        action: 'auth.login',
        targetType: 'session',
        targetId: row.id,
        payload: { email: row.email, sessionId },
      });
    });
    return {
      user: { id: row.id, email: row.email, name: row.name, role: row.role },
      token: await signSessionToken(key, row.id, sessionId, sessionTtlSeconds),
      csrfToken: csrfTokenFor(key, sessionId),
    };
  }

  /** Checks a presented token against the live session and account; null means "not signed in". */
  async function authenticate(token: string, via: SessionUser['via']): Promise<AuthenticatedSession | null> {
    const key = await sessionKey();
    const claims = await readSessionToken(key, token);
    if (!claims) return null;
    const [found] = await db
      .select({ user: users, session: sessions })
      .from(sessions)
      .innerJoin(users, eq(users.id, sessions.userId))
      .where(
        and(
          eq(sessions.id, claims.sessionId),
          eq(sessions.userId, claims.userId),
          isNull(sessions.revokedAt),
          gt(sessions.expiresAt, new Date()),
        ),
      );
    if (!found || !found.user.active) return null;
    const ageSeconds = Date.now() / 1000 - claims.issuedAt;
    const rotatedToken =
      ageSeconds > sessionTtlSeconds / 3
        ? await signSessionToken(key, found.user.id, claims.sessionId, sessionTtlSeconds)
        : undefined;
    const { id, email, name, role } = found.user;
    return {
      user: { id, email, name, role, sessionId: claims.sessionId, via },
      csrfToken: csrfTokenFor(key, claims.sessionId),
      rotatedToken,
    };
  }

  async function logOut(user: Actor & { sessionId: string }): Promise<void> {
    await db.transaction(async (tx) => {
      await tx.update(sessions).set({ revokedAt: new Date() }).where(eq(sessions.id, user.sessionId));
      await audit.append(tx, {
        actor: user,
        action: 'auth.logout',
        targetType: 'session',
        targetId: user.sessionId,
      });
    });
  }

  /** Ends every session of a user inside `tx`, e.g. when an admin deactivates the account. */
  async function revokeAllSessions(tx: Transaction, userId: string): Promise<void> {
    await tx
      .update(sessions)
      .set({ revokedAt: new Date() })
      .where(and(eq(sessions.userId, userId), isNull(sessions.revokedAt)));
  }

  return { logIn, authenticate, logOut, revokeAllSessions };
}

export type AuthService = ReturnType<typeof createAuthService>;
