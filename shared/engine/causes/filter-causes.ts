/**
 * filter_settings: the robot's own localizer departed from the replay while nothing else explains
 * it, and the replay under its settings stayed on the reference trajectory over that window.
 */

import { fixed, rangeOver } from '../flags/intervals';
import { ONBOARD_DISTANCE } from '../flags/onboard-departure';
import type { ScoredCause } from './cause-score';
import type { CauseInput, CounterfactualRun } from './cause-types';
import { type RunCounterfactual, stepAt, windowAround, windowSettings } from './counterfactual-runner';

/** Onboard departure (m) that counts as full evidence. */
const FULL_DEPARTURE = 1;
/** Other causes within this many seconds of the departure explain it instead. */
const EXPLAINED_WITHIN = 2;

/** Candidate localizer-settings causes: onboard departures no other candidate overlaps. */
export function findFilterCauses(
  input: CauseInput,
  run: RunCounterfactual,
  others: ScoredCause[],
): ScoredCause[] {
  const { series } = input;
  const causes: ScoredCause[] = [];
  for (const flag of input.flags) {
    if (flag.kind !== 'onboard_departed_from_replay') continue;
    const isExplained = others.some(
      (cause) => cause.start <= flag.end + EXPLAINED_WITHIN && cause.end >= flag.start - EXPLAINED_WITHIN,
    );
    if (isExplained) continue;
    const interval = { first: stepAt(series, flag.start), last: stepAt(series, flag.end) };
    const departure = rangeOver(series.error_onboard, interval).max;
    const settings = windowSettings(input, windowAround(series, flag.start, flag.end));
    const result = run(settings);
    const replayError = rangeOver(result.series.error_reference, {
      first: 0,
      last: result.series.t.length - 1,
    }).max;
    const hasReference = Number.isFinite(replayError);
    const counterfactual: CounterfactualRun = {
      label: "The replay's own settings over the same stretch of log",
      settings,
      digest: result.digest,
      metric: 'largest distance of the replay from the reference trajectory (m)',
      value: hasReference ? replayError : Number.NaN,
      supports: hasReference && replayError < ONBOARD_DISTANCE,
    };
    causes.push({
      kind: 'filter_settings',
      start: flag.start,
      end: flag.end,
      strength: departure / FULL_DEPARTURE,
      evidence: `The onboard estimate departed up to ${fixed(departure, 2)} m from the replay while no odometry, map or sensor cause was found; the replay stayed within ${hasReference ? `${fixed(replayError, 2)} m` : 'an unknown distance'} of the reference.`,
      against: hasReference
        ? ''
        : 'Without a reference trajectory it cannot be told which of the two estimates was right.',
      counterfactuals: [counterfactual],
      gain: Number.NaN,
    });
  }
  return causes;
}
