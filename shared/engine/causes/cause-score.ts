/**
 * Confidence of a cause from the strength of its evidence and its counterfactuals: a cause no
 * counterfactual supports stays below 0.5 however strong its evidence (docs/causes.md).
 */
import type { CauseKind, CounterfactualRun, ProbableCause } from './cause-types';

/** Confidence range without counterfactual support, [0, UNSUPPORTED_CEILING]. */
export const UNSUPPORTED_CEILING = 0.45;
/** Confidence range with support, [SUPPORTED_FLOOR, SUPPORTED_FLOOR + SUPPORTED_SPAN]. */
export const SUPPORTED_FLOOR = 0.55;
export const SUPPORTED_SPAN = 0.4;

export interface ScoredCause {
  kind: CauseKind;
  start: number;
  end: number;
  /** Strength of the discriminating evidence, [0, 1]. */
  strength: number;
  evidence: string;
  against: string;
  counterfactuals: CounterfactualRun[];
  /**
   * How much better the scans fit in its counterfactual (nats per measurement), to compare
   * overlapping causes; NaN when the counterfactual measures something else.
   */
  gain: number;
  /** Set when an overlapping cause's counterfactual explains the interval far better (explain-away.ts). */
  explainedBy?: string;
}

/** Rounds to 3 decimals so the JSON reads cleanly; the rounding is deterministic. */
const round3 = (value: number) => Math.round(value * 1000) / 1000;

export function scoreCause(cause: ScoredCause): ProbableCause {
  const strength = Math.min(1, Math.max(0, Number.isFinite(cause.strength) ? cause.strength : 0));
  const isSupported = !cause.explainedBy && cause.counterfactuals.some((run) => run.supports);
  const confidence = isSupported
    ? SUPPORTED_FLOOR + SUPPORTED_SPAN * strength
    : UNSUPPORTED_CEILING * strength;
  return {
    kind: cause.kind,
    start: cause.start,
    end: cause.end,
    confidence: round3(confidence),
    evidence: cause.evidence,
    against: [cause.against, cause.explainedBy ?? ''].filter(Boolean).join(' '),
    counterfactuals: cause.counterfactuals,
  };
}
