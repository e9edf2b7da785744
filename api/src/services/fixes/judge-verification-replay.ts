import { eq } from 'drizzle-orm';
import type { TReplay, TReplayFlag } from '../../../../shared/contracts/replays';
import {
  type FixOutcome,
  judgeFixOutcome,
  pickOriginalReplay,
  type ReplayForComparison,
} from '../../../../shared/fixes/fix-outcome';
import type { Transaction } from '../../db/client';
import { type ReplayRow, replays } from '../../db/schema';

function forComparison(row: ReplayRow): ReplayForComparison {
  return {
    id: row.id,
    bundleId: row.bundleId,
    status: row.status,
    createdAt: row.createdAt.toISOString(),
    overrides: row.overrides as TReplay['overrides'],
    flags: (row.flags as TReplayFlag[] | null) ?? [],
    metrics: (row.metrics as TReplay['metrics']) ?? null,
  };
}

/**
 * Judges a fix's verification replay against the incident replay the fix card shows beside it,
 * with the same shared rule, so the API refuses exactly what the card warns about.
 */
export async function judgeVerificationReplay(
  tx: Transaction,
  verificationReplayId: string | null,
): Promise<FixOutcome> {
  if (!verificationReplayId) return judgeFixOutcome(undefined, undefined);
  const [verificationRow] = await tx.select().from(replays).where(eq(replays.id, verificationReplayId));
  if (!verificationRow) return judgeFixOutcome(undefined, undefined);
  const verification = forComparison(verificationRow);
  const sameBundle = await tx.select().from(replays).where(eq(replays.bundleId, verificationRow.bundleId));
  return judgeFixOutcome(pickOriginalReplay(sameBundle.map(forComparison), verification), verification);
}
