import type { TReplay } from '../contracts/replays';

/**
 * Whether a fix's verification replay did better than the incident replay it is compared with.
 * Pure, so the fix card's warning and the API's refusal to verify without a confirmation agree.
 */

/** What of a replay the comparison reads; both a contract replay and a mapped row have it. */
export type ReplayForComparison = Pick<
  TReplay,
  'id' | 'bundleId' | 'status' | 'createdAt' | 'overrides' | 'flags' | 'metrics'
>;

/**
 * The replay a fix is compared against: the earliest finished replay of the same bundle run with
 * the manifest's own settings (no overrides), else the earliest finished one other than the fix's.
 */
export function pickOriginalReplay<R extends ReplayForComparison>(
  replays: readonly R[],
  verification: ReplayForComparison,
): R | undefined {
  const candidates = replays
    .filter((r) => r.bundleId === verification.bundleId && r.id !== verification.id && r.status === 'done')
    .sort((a, b) => a.createdAt.localeCompare(b.createdAt));
  return candidates.find((r) => Object.keys(r.overrides).length === 0) ?? candidates[0];
}

export const countCriticalFlags = (replay: Pick<TReplay, 'flags'>): number =>
  replay.flags.filter((flag) => flag.severity === 'critical').length;

export type FixOutcome =
  | { kind: 'improved'; improvements: string[] }
  | { kind: 'not_improved' | 'no_comparison'; warning: string };

/**
 * Improved means at least one of: fewer critical flags, divergence from the reference gone or
 * later, lower RMSE against the reference. Anything else (or nothing to compare) is a warning the
 * verifier must confirm they have read.
 */
export function judgeFixOutcome(
  original: ReplayForComparison | undefined,
  verification: ReplayForComparison | undefined,
): FixOutcome {
  if (verification?.status !== 'done')
    return {
      kind: 'no_comparison',
      warning: 'The fix has no finished verification replay, so nothing shows that the problem is gone.',
    };
  if (!original)
    return {
      kind: 'no_comparison',
      warning:
        'No other finished replay of the same bundle exists to compare with, so nothing shows that the problem is gone.',
    };
  const improvements: string[] = [];
  const criticalBefore = countCriticalFlags(original);
  const criticalAfter = countCriticalFlags(verification);
  if (criticalAfter < criticalBefore)
    improvements.push(`critical flags went from ${criticalBefore} to ${criticalAfter}`);
  const divergedBefore = original.metrics?.diverged_at ?? null;
  const divergedAfter = verification.metrics?.diverged_at ?? null;
  if (divergedBefore !== null && divergedAfter === null)
    improvements.push('the replay no longer diverges from the reference');
  else if (divergedBefore !== null && divergedAfter !== null && divergedAfter > divergedBefore)
    improvements.push(
      `divergence from the reference moved from ${divergedBefore.toFixed(1)} s to ${divergedAfter.toFixed(1)} s`,
    );
  const rmseBefore = original.metrics?.rmse_reference ?? null;
  const rmseAfter = verification.metrics?.rmse_reference ?? null;
  if (rmseBefore !== null && rmseAfter !== null && rmseAfter < rmseBefore)
    improvements.push(
      `RMSE against the reference went from ${rmseBefore.toFixed(3)} m to ${rmseAfter.toFixed(3)} m`,
    );
  if (improvements.length > 0) return { kind: 'improved', improvements };
  return {
    kind: 'not_improved',
    warning:
      'The verification replay did not improve on the original: no fewer critical flags, no later or vanished divergence, no lower RMSE against the reference.',
  };
}
