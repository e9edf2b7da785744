/**
 * Explaining away: two causes over overlapping intervals compete for the same evidence. When one
 * counterfactual makes the scans fit far better than the other's, the weaker cause loses its
 * counterfactual support (it stays listed, below 0.5, with the reason).
 */
import { fixed } from '../flags/intervals';
import type { ScoredCause } from './cause-score';

/** The stronger counterfactual must gain at least this many times as much ... */
export const EXPLAIN_AWAY_RATIO = 2;
/** ... and at least this much (nats per measurement). */
export const EXPLAIN_AWAY_MIN_GAIN = 0.5;

const overlaps = (a: ScoredCause, b: ScoredCause) => a.start <= b.end && b.start <= a.end;
const isSupported = (cause: ScoredCause) => cause.counterfactuals.some((run) => run.supports);

/** Marks `explainedBy` on every supported cause an overlapping supported cause of another kind outdoes. */
export function explainAway(causes: ScoredCause[]): ScoredCause[] {
  return causes.map((cause) => {
    if (!isSupported(cause) || !Number.isFinite(cause.gain)) return cause;
    const rival = causes
      .filter(
        (other) =>
          other !== cause &&
          other.kind !== cause.kind &&
          isSupported(other) &&
          overlaps(cause, other) &&
          other.gain >= EXPLAIN_AWAY_MIN_GAIN &&
          other.gain >= EXPLAIN_AWAY_RATIO * Math.max(cause.gain, 0),
      )
      .sort((a, b) => b.gain - a.gain)[0];
    if (!rival) return cause;
    return {
      ...cause,
      explainedBy: `The ${rival.kind.replace('_', ' ')} counterfactual explains the same interval better (${fixed(rival.gain, 2)} against ${fixed(cause.gain, 2)} nats per measurement).`,
    };
  });
}
