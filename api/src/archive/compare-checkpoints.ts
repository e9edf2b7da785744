import { compactVerify, createLocalJWKSet, type JSONWebKeySet } from 'jose';
import type { AuditChainEntry } from '../../../shared/audit-chain';
import { SIGNING_ALG } from '../services/signing/signing-key';

export const CHECKPOINT_TYP = 'driftcase-audit-checkpoint+jws';

/** A signed statement that a chain's entry `chainSeq` had hash `entryHash` at time `at`. */
export interface AuditCheckpoint {
  chain: string;
  chainSeq: number;
  entryHash: string;
  /** RFC 3339 */
  at: string;
  /** Why it was made: `export`, `daily`, `start-up`. */
  reason: string;
}

export interface CheckpointComparison {
  /** Checkpoints of this chain that were compared. */
  checked: number;
  /** One plain sentence per checkpoint the chain contradicts. */
  problems: string[];
}

/**
 * Compares a chain with the checkpoints of it: each checkpointed entry must still be there with
 * the same hash. An insider who edits a row and re-computes every later hash gets an intact chain,
 * but not the hashes that were signed and sent away before the edit. Checkpoints made after
 * `until` (e.g. an archive's export time) are not expected to be covered.
 */
export function compareWithCheckpoints(
  chain: string,
  entries: readonly AuditChainEntry[],
  checkpoints: readonly AuditCheckpoint[],
  until?: string,
): CheckpointComparison {
  const relevant = checkpoints.filter((c) => c.chain === chain && (!until || c.at <= until));
  const problems: string[] = [];
  for (const checkpoint of relevant) {
    const entry = entries[checkpoint.chainSeq - 1];
    if (checkpoint.chainSeq === 0) continue;
    if (!entry)
      problems.push(
        `the chain has ${entries.length} entries, but a checkpoint made at ${checkpoint.at} (${checkpoint.reason}) recorded entry ${checkpoint.chainSeq}: entries were removed`,
      );
    else if (entry.entryHash !== checkpoint.entryHash)
      problems.push(
        `entry ${checkpoint.chainSeq} is not the one checkpointed at ${checkpoint.at} (${checkpoint.reason}): the trail was edited and re-chained after that checkpoint`,
      );
  }
  return { checked: relevant.length, problems };
}

/** Reads checkpoint lines (compact JWS), keeping those whose signature verifies against `jwks`. */
export async function readCheckpointLines(
  lines: readonly string[],
  jwks: JSONWebKeySet,
): Promise<{ checkpoints: AuditCheckpoint[]; problems: string[] }> {
  const keys = createLocalJWKSet(jwks);
  const checkpoints: AuditCheckpoint[] = [];
  const problems: string[] = [];
  for (const [index, line] of lines.entries()) {
    if (!line.trim()) continue;
    try {
      const { payload, protectedHeader } = await compactVerify(line.trim(), keys, {
        algorithms: [SIGNING_ALG],
      });
      if (protectedHeader.typ !== CHECKPOINT_TYP)
        throw new Error(`not a checkpoint (typ ${protectedHeader.typ})`);
      checkpoints.push(JSON.parse(new TextDecoder().decode(payload)) as AuditCheckpoint);
    } catch (error) {
      problems.push(
        `checkpoint line ${index + 1}: signature does not verify against a trusted key (${(error as Error).message})`,
      );
    }
  }
  return { checkpoints, problems };
}
