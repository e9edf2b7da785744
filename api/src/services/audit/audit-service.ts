import { createHash } from 'node:crypto';
import { asc, count, desc, eq, sql } from 'drizzle-orm';
import {
  type AuditChainEntry,
  auditChainOf,
  computeAuditEntryHash,
  GENESIS_HASH,
  verifyAuditChain,
} from '../../../../shared/audit-chain';
import { canonicalJson } from '../../../../shared/canonical-json';
import { type TAuditList, type TAuditListQuery, ZAuditListQuery } from '../../../../shared/contracts/audit';
import type { Database } from '../../db/client';
import { type AuditEntryRow, auditEntries } from '../../db/schema';

export interface AuditActor {
  id: string;
  email: string;
  role: string;
}

export interface AppendAuditInput {
  actor: AuditActor | null;
  action: string;
  targetType: string;
  targetId?: string | null;
  caseId?: string | null;
  /** Hashed with RFC 8785 canonical JSON; only the hash is kept. */
  payload: unknown;
  details?: Record<string, unknown>;
}

export type AuditListener = (entry: AuditChainEntry) => Promise<void> | void;

function toEntry(row: AuditEntryRow): AuditChainEntry {
  return { ...row, details: row.details as Record<string, unknown> };
}

/** SHA-256 (hex) of a payload's canonical JSON. */
export function payloadSha256(payload: unknown): string {
  return createHash('sha256')
    .update(canonicalJson(payload ?? null))
    .digest('hex');
}

/**
 * The append-only audit trail. There is deliberately no update or delete here; the database
 * trigger refuses them too.
 */
export function createAuditService({ db }: { db: Database }) {
  const listeners: AuditListener[] = [];

  /** Appends one entry to its chain; appends to one chain are serialized by an advisory lock. */
  async function append(input: AppendAuditInput): Promise<AuditChainEntry> {
    const chain = auditChainOf(input.caseId);
    const entry = await db.transaction(async (tx) => {
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
        payloadSha256: payloadSha256(input.payload),
        details: input.details ?? {},
        prevHash: last?.entryHash ?? GENESIS_HASH,
      };
      const [row] = await tx
        .insert(auditEntries)
        .values({ ...unhashed, entryHash: computeAuditEntryHash(unhashed) })
        .returning();
      return toEntry(row);
    });
    for (const listener of listeners) await listener(entry);
    return entry;
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
    listCaseEntries: (caseId: string, query?: TAuditListQuery) => listChain(auditChainOf(caseId), query),
    listGlobalEntries: (query?: TAuditListQuery) => listChain(auditChainOf(null), query),
    readCaseChain: (caseId: string) => readChain(auditChainOf(caseId)),
    verifyCaseChain: async (caseId: string) => verifyAuditChain(await readChain(auditChainOf(caseId))),
    verifyGlobalChain: async () => verifyAuditChain(await readChain(auditChainOf(null))),
    /** Runs after each append (e.g. the lifecycle reacting to a first bundle upload). */
    onAppended(listener: AuditListener) {
      listeners.push(listener);
    },
  };
}

export type AuditService = ReturnType<typeof createAuditService>;
