import { and, eq, isNull, lt, or, sql } from 'drizzle-orm';
import { AppError } from '../../../../shared/errors';
import type { Database, Transaction } from '../../db/client';
import { signInThrottle } from '../../db/schema';

/** How many attempts a key may make in one window, and how long its first lock lasts. */
export interface ThrottleRule {
  maxFailures: number;
  windowMs: number;
  firstLockMs: number;
  longestLockMs: number;
}

/**
 * Per account: ten failures in fifteen minutes, from any number of addresses, lock it for a
 * minute, then two, four, ... up to an hour (OWASP Authentication Cheat Sheet, "Login Throttling":
 * count failures per account, not per source, and back off exponentially; the numbers are ours).
 */
export const ACCOUNT_RULE: ThrottleRule = {
  maxFailures: 10,
  windowMs: 15 * 60_000,
  firstLockMs: 60_000,
  longestLockMs: 60 * 60_000,
};

/** Per client address, across accounts: fifty failures in fifteen minutes lock it for fifteen minutes, doubling. */
export const ADDRESS_RULE: ThrottleRule = {
  maxFailures: 50,
  windowMs: 15 * 60_000,
  firstLockMs: 15 * 60_000,
  longestLockMs: 4 * 60 * 60_000,
};

/** Locks older than this are forgotten, so an account's backoff starts again from the first step. */
const LOCKOUT_MEMORY_MS = 24 * 60 * 60_000;

export interface SignInAttempt {
  email: string;
  address: string;
}

const accountKey = (email: string) => `account:${email.trim().toLowerCase()}`;
const addressKey = (address: string) => `address:${address}`;

function lockMs(rule: ThrottleRule, lockouts: number): number {
  return Math.min(rule.firstLockMs * 2 ** (lockouts - 1), rule.longestLockMs);
}

/**
 * Counts every sign-in attempt before its password is checked (so a flood of parallel attempts
 * is counted as it arrives, not after the hashing), and takes the count back when the attempt
 * succeeds. A locked key is refused with 429 before any password hashing.
 */
export function createSignInThrottle({
  db,
  accountRule = ACCOUNT_RULE,
  addressRule = ADDRESS_RULE,
}: {
  db: Database;
  accountRule?: ThrottleRule;
  addressRule?: ThrottleRule;
}) {
  /** Counts one attempt against `key`; returns the lock's end when the key is (now) locked. */
  async function countAttempt(tx: Transaction, key: string, rule: ThrottleRule, now: Date) {
    await tx.insert(signInThrottle).values({ key, windowStartedAt: now }).onConflictDoNothing();
    const [row] = await tx.select().from(signInThrottle).where(eq(signInThrottle.key, key)).for('update');
    if (row.lockedUntil && row.lockedUntil > now) return row.lockedUntil;
    const isWindowOver = now.getTime() - row.windowStartedAt.getTime() > rule.windowMs;
    const isLockForgotten = !row.lockedUntil || now.getTime() - row.lockedUntil.getTime() > LOCKOUT_MEMORY_MS;
    const failures = isWindowOver ? 0 : row.failures;
    const lockouts = isLockForgotten ? 0 : row.lockouts;
    if (failures >= rule.maxFailures) {
      const lockedUntil = new Date(now.getTime() + lockMs(rule, lockouts + 1));
      await tx
        .update(signInThrottle)
        .set({ failures: 0, windowStartedAt: now, lockouts: lockouts + 1, lockedUntil })
        .where(eq(signInThrottle.key, key));
      return lockedUntil;
    }
    await tx
      .update(signInThrottle)
      .set({ failures: failures + 1, lockouts, ...(isWindowOver ? { windowStartedAt: now } : {}) })
      .where(eq(signInThrottle.key, key));
    return undefined;
  }

  let lastPrunedAt = 0;
  /** Rows of keys that have been quiet for a day carry no information; a flood of made-up e-mails must not pile up. */
  async function pruneQuietKeys(now: Date): Promise<void> {
    if (now.getTime() - lastPrunedAt < 60_000) return;
    lastPrunedAt = now.getTime();
    const quietSince = new Date(now.getTime() - LOCKOUT_MEMORY_MS);
    await db
      .delete(signInThrottle)
      .where(
        and(
          lt(signInThrottle.windowStartedAt, quietSince),
          or(isNull(signInThrottle.lockedUntil), lt(signInThrottle.lockedUntil, quietSince)),
        ),
      );
  }

  /** Counts the attempt for its account and its address; throws 429 when either is locked. */
  async function admit(attempt: SignInAttempt, now = new Date()): Promise<void> {
    await pruneQuietKeys(now);
    const lockedUntil = await db.transaction(async (tx) => {
      // Always in this order (account, then address), so two attempts never wait on each other's rows.
      const byAccount = await countAttempt(tx, accountKey(attempt.email), accountRule, now);
      const byAddress = await countAttempt(tx, addressKey(attempt.address), addressRule, now);
      return [byAccount, byAddress].filter((d): d is Date => d !== undefined).sort((a, b) => +b - +a)[0];
    });
    if (!lockedUntil) return;
    const retryAfterSeconds = Math.max(1, Math.ceil((lockedUntil.getTime() - now.getTime()) / 1000));
    throw new AppError(
      'too_many_requests',
      `Too many failed sign-in attempts. Try again in ${describeWait(retryAfterSeconds)}.`,
      { retryAfterSeconds },
    );
  }

  /** A successful sign-in clears its account's count and takes its attempt off the address's count. */
  async function succeeded(attempt: SignInAttempt): Promise<void> {
    await db.transaction(async (tx) => {
      await tx.delete(signInThrottle).where(eq(signInThrottle.key, accountKey(attempt.email)));
      await tx
        .update(signInThrottle)
        .set({ failures: sql`greatest(${signInThrottle.failures} - 1, 0)` })
        .where(eq(signInThrottle.key, addressKey(attempt.address)));
    });
  }

  return { admit, succeeded };
}

function describeWait(seconds: number): string {
  if (seconds < 90) return `${seconds} seconds`;
  return `${Math.ceil(seconds / 60)} minutes`;
}

export type SignInThrottle = ReturnType<typeof createSignInThrottle>;
