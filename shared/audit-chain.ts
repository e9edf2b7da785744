import { canonicalJson } from './canonical-json';
import { sha256Hex } from './engine/sha256';

/**
 * The audit trail's hash chain, pure so the server, the archive and an offline verifier check it
 * the same way.
 *
 * entry_hash = SHA-256 (hex) of the RFC 8785 canonical JSON of the object
 *   { chain, chainSeq, actorId, actorEmail, actorRole, action, targetType, targetId, caseId,
 *     at, payloadSha256, details, prevHash }
 * with absent values as null. prevHash is the entry_hash of the entry before it in the same
 * chain, or 64 zeros for the first entry.
 */

export const GENESIS_HASH = '0'.repeat(64);

export interface AuditChainEntry {
  id?: number;
  chain: string;
  chainSeq: number;
  actorId: string | null;
  actorEmail: string | null;
  actorRole: string | null;
  action: string;
  targetType: string;
  targetId: string | null;
  caseId: string | null;
  /** RFC 3339 time as recorded. */
  at: string;
  payloadSha256: string;
  details: Record<string, unknown>;
  prevHash: string;
  entryHash: string;
}

/** The chain name of a case, or the global chain for case-less actions. */
export function auditChainOf(caseId: string | null | undefined): string {
  return caseId ? `case:${caseId}` : 'global';
}

/** SHA-256 of the documented canonical serialization of an entry (everything but its own hash). */
export function computeAuditEntryHash(entry: Omit<AuditChainEntry, 'entryHash' | 'id'>): string {
  const hashed = {
    chain: entry.chain,
    chainSeq: entry.chainSeq,
    actorId: entry.actorId,
    actorEmail: entry.actorEmail,
    actorRole: entry.actorRole,
    action: entry.action,
    targetType: entry.targetType,
    targetId: entry.targetId,
    caseId: entry.caseId,
    at: entry.at,
    payloadSha256: entry.payloadSha256,
    details: entry.details,
    prevHash: entry.prevHash,
  };
  return sha256Hex(new TextEncoder().encode(canonicalJson(hashed)));
}

export interface AuditChainBreak {
  chainSeq: number;
  id?: number;
  reason: string;
}

export interface AuditChainReport {
  ok: boolean;
  entries: number;
  firstBroken?: AuditChainBreak;
}

/**
 * Walks a chain in order and reports the first entry whose own hash, link or position is wrong.
 * A deleted entry shows up at the entry after the gap; an edited one at itself.
 */
export function verifyAuditChain(entries: readonly AuditChainEntry[]): AuditChainReport {
  let expectedPrev = GENESIS_HASH;
  for (let index = 0; index < entries.length; index++) {
    const entry = entries[index];
    const at = { chainSeq: entry.chainSeq, id: entry.id };
    if (entry.chainSeq !== index + 1) {
      return broken(
        entries.length,
        at,
        `expected position ${index + 1} in the chain, found ${entry.chainSeq}`,
      );
    }
    if (entry.prevHash !== expectedPrev) {
      return broken(entries.length, at, 'prev_hash does not match the entry before it');
    }
    if (computeAuditEntryHash(entry) !== entry.entryHash) {
      return broken(entries.length, at, 'entry_hash does not match the entry content');
    }
    expectedPrev = entry.entryHash;
  }
  return { ok: true, entries: entries.length };
}

function broken(count: number, at: { chainSeq: number; id?: number }, reason: string): AuditChainReport {
  return { ok: false, entries: count, firstBroken: { ...at, reason } };
}
