/**
 * Probable causes of a finished replay, highest confidence first: candidates from the flags,
 * each scored on its discriminating evidence and tested by counterfactual replays over a window
 * around its interval. Pure and deterministic; rules and thresholds in docs/causes.md.
 */
import { fixed } from '../flags/intervals';
import { measureCauseEvidence } from './cause-evidence';
import { type ScoredCause, scoreCause } from './cause-score';
import { type CauseFlag, type CauseInput, NON_FAULT_KINDS, type ProbableCause } from './cause-types';
import { createCounterfactualRunner } from './counterfactual-runner';
import { explainAway } from './explain-away';
import { findFilterCauses } from './filter-causes';
import { findMapCauses } from './map-causes';
import { findOdometryCauses } from './odometry-causes';
import { findScaleCauses } from './odometry-scale';
import { findSensorCauses } from './sensor-causes';

/** At most this many flags of one kind are examined (the longest), to bound the counterfactual work. */
export const MAX_FLAGS_PER_KIND = 4;
/** Confidence a fault cause needs to count as found. */
export const FOUND_CONFIDENCE = 0.5;

/** The longest MAX_FLAGS_PER_KIND flags of each kind, in their original order. */
function pickFlags(flags: readonly CauseFlag[]): CauseFlag[] {
  const byKind = new Map<string, CauseFlag[]>();
  for (const flag of flags) byKind.set(flag.kind, [...(byKind.get(flag.kind) ?? []), flag]);
  const kept = new Set<CauseFlag>();
  for (const group of byKind.values())
    for (const flag of [...group]
      .sort((a, b) => b.end - b.start - (a.end - a.start) || a.start - b.start)
      .slice(0, MAX_FLAGS_PER_KIND))
      kept.add(flag);
  return flags.filter((flag) => kept.has(flag));
}

export function findProbableCauses(full: CauseInput): ProbableCause[] {
  const input = { ...full, flags: pickFlags(full.flags) };
  const run = createCounterfactualRunner(input);
  const hasScans = Boolean(input.context.field && input.context.beams);
  const candidates: ScoredCause[] = hasScans
    ? [
        ...findOdometryCauses(input, measureCauseEvidence(input), run),
        ...findScaleCauses(input, run),
        ...findMapCauses(input, run),
        ...findSensorCauses(input, run),
      ]
    : [];
  candidates.push(...findFilterCauses(input, run, candidates));
  const causes: ProbableCause[] = explainAway(candidates).map(scoreCause);
  const faults = causes.filter((cause) => !NON_FAULT_KINDS.includes(cause.kind));
  const strongest = faults.reduce((best, cause) => Math.max(best, cause.confidence), 0);
  if (strongest < FOUND_CONFIDENCE) {
    const { t } = input.series;
    causes.push({
      kind: 'none',
      start: t[0] ?? 0,
      end: t[t.length - 1] ?? 0,
      confidence: Math.round((1 - strongest) * 1000) / 1000,
      evidence: `No fault cause reached confidence ${FOUND_CONFIDENCE}: ${faults.length} candidate(s) examined, the strongest at ${fixed(strongest, 2)}.`,
      against: '',
      counterfactuals: [],
    });
  }
  return causes.sort((a, b) => b.confidence - a.confidence || a.start - b.start);
}
