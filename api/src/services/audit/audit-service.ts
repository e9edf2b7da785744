import { createHash } from 'node:crypto';
import { asc, count, desc, eq, sql } from 'drizzle-orm';
import type { AuditAction } from '../../../../shared/audit-actions';
import {
  type AuditChainEntry,
  auditChainOf,
  computeAuditEntryHash,
  GENESIS_HASH,
  verifyAuditChain,
} from '../../../../shared/audit-chain';
import { canonicalJson } from '../../../../shared/canonical-json';
import { type TAuditList, type TAuditListQuery, ZAuditListQuery } from '../../../../shared/contracts/audit';
import { isSafeText } from '../../../../shared/contracts/safe-text';
import { AppError } from '../../../../shared/errors';
import type { Database, Transaction } from '../../db/client';
import { type AuditEntryRow, auditEntries } from '../../db/schema';
import type { Actor } from '../actor';
import { assertCaseMember } from '../membership/case-access';

export interface AuditActor {
  id: string;
  email: string;
  role: string;
}

/** One audit entry as a service states it, from values it has validated. */
export interface AuditEntryInput {
  /** Who acted; only id, e-mail and role are recorded (a session user can be passed as is). */
  actor: AuditActor | null;
  action: AuditAction;
  targetType: string;
  targetId?: string | null;
  /** Puts the entry in this case's chain; without it the entry joins the global chain. */
  caseId?: string | null;
  /** Small, human-readable facts for the case history (e.g. a status change). Stored as jsonb. */
  details?: Record<string, unknown>;
  /** What the action was given, after validation and without secrets; only its hash is kept. Defaults to `details`. */
  payload?: unknown;
}

function toEntry(row: AuditEntryRow): AuditChainEntry {
  return { ...row, details: row.details as Record<string, unknown> };
}

/** SHA-256 (hex) of a payload's canonical JSON. */
export function payloadSha256(payload: unknown): string {
  return createHash('sha256')
    .update(canonicalJson(payload ?? null))
    .digest('hex');
}

/** The first string or key in `value` that jsonb would refuse, as a path, or null. */
function unsafeTextIn(value: unknown, path: string): string | null {
  if (typeof value === 'string') return isSafeText(value) ? null : path;
  if (Array.isArray(value)) {
    for (const [index, item] of value.entries()) {
      const found = unsafeTextIn(item, `${path}.${index}`);
      if (found) return found;
    }
  } else if (value && typeof value === 'object') {
    for (const [key, item] of Object.entries(value)) {
      if (!isSafeText(key)) return `${path}.(a field name)`;
      const found = unsafeTextIn(item, `${path}.${key}`);
      if (found) return found;
    }
  }
  return null;
}

/**
 * The append-only audit trail. There is deliberately no update or delete here; the database
 * trigger refuses them too.
 */
const SEE_HISTORY = 'see its audit trail';

export function createAuditService({ db }: { db: Database }) {
  /**
   * Appends one entry inside the caller's transaction, so it commits with the write it records or
   * not at all. Appends to one chain are serialized by an advisory lock held until that commit.
   * Any failure becomes `audit_failed`, which rolls the caller's transaction back.
   */
  async function append(tx: Transaction, input: AuditEntryInput): Promise<AuditChainEntry> {
    const chain = auditChainOf(input.caseId);
    const details = input.details ?? {};
    try {
      const unsafe = unsafeTextIn(details, 'details');
      if (unsafe) throw new Error(`${unsafe} holds text that cannot be stored (NUL or a lone surrogate)`);
      await tx.execute(sql`select pg_advisory_xact_lock(hashtext(${chain}))`);
      const [last] = await tx
        .select({ chainSeq: auditEntries.chainSeq, entryHash: auditEntries.entryHash })
        .from(auditEntries)
        .where(eq(auditEntries.chain, chain))
        .orderBy(desc(auditEntries.chainSeq))
        .limit(1);
      const unhashed = {
        chain,
        chainSeq: (last?.chainSeq ?? 0) + 1,
        actorId: input.actor?.id ?? null,
        actorEmail: input.actor?.email ?? null,
        actorRole: input.actor?.role ?? null,
        action: input.action,
        targetType: input.targetType,
        targetId: input.targetId ?? null,
        caseId: input.caseId ?? null,
        at: new Date().toISOString(),
        payloadSha256: payloadSha256(input.payload === undefined ? details : input.payload),
        details,
        prevHash: last?.entryHash ?? GENESIS_HASH,
      };
      const [row] = await tx
        .insert(auditEntries)
        .values({ ...unhashed, entryHash: computeAuditEntryHash(unhashed) })
        .returning();
      return toEntry(row);
    } catch (error) {
      throw new AppError(
        'audit_failed',
        `Nothing was saved: the audit entry for this action (${input.action}) could not be written. Try again; if it keeps failing, tell an administrator.`,
        undefined,
        { cause: error },
      );
    }
  }

  /**
   * For an action whose only database record is its audit entry (an archive exported or
   * verified, a replay cancelled): appends in a transaction of its own.
   */
  function appendAlone(input: AuditEntryInput): Promise<AuditChainEntry> {
    return db.transaction((tx) => append(tx, input));
  }

  async function listChain(chain: string, rawQuery: TAuditListQuery = {}): Promise<TAuditList> {
    const query = ZAuditListQuery.parse(rawQuery);
    const rows = await db
      .select()
      .from(auditEntries)
      .where(eq(auditEntries.chain, chain))
      .orderBy(asc(auditEntries.chainSeq))
      .limit(query.pageSize)
      .offset((query.page - 1) * query.pageSize);
    const [{ total }] = await db
      .select({ total: count() })
      .from(auditEntries)
      .where(eq(auditEntries.chain, chain));
    return {
      items: rows.map(toEntry) as TAuditList['items'],
      total,
      page: query.page,
      pageSize: query.pageSize,
    };
  }

  /** Every entry of a chain in order, e.g. for verification or the archive. */
  async function readChain(chain: string): Promise<AuditChainEntry[]> {
    const rows = await db
      .select()
      .from(auditEntries)
      .where(eq(auditEntries.chain, chain))
      .orderBy(asc(auditEntries.chainSeq));
    return rows.map(toEntry);
  }

  return {
    append,
    appendAlone,
    /** A case's history, for its members. */
    listCaseEntries: async (caseId: string, query: TAuditListQuery | undefined, actor: Actor) => {
      await assertCaseMember(db, caseId, actor, SEE_HISTORY);
      return listChain(auditChainOf(caseId), query);
    },
    listGlobalEntries: (query?: TAuditListQuery) => listChain(auditChainOf(null), query),
    readChain,
    /** A case's whole chain, unchecked: for the archive export, which checks membership once. */
    readCaseChain: (caseId: string) => readChain(auditChainOf(caseId)),
    /** A case's whole chain, for its members to verify. */
    readCaseChainFor: async (caseId: string, actor: Actor) => {
      await assertCaseMember(db, caseId, actor, SEE_HISTORY);
      return readChain(auditChainOf(caseId));
    },
    verifyCaseChain: async (caseId: string) => verifyAuditChain(await readChain(auditChainOf(caseId))),
    verifyGlobalChain: async () => verifyAuditChain(await readChain(auditChainOf(null))),
  };
}

export type AuditService = ReturnType<typeof createAuditService>;
