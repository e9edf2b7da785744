/**
 * sensor_degraded: starts from a `sensor_evidence_dropped` flag. The returns are implausible in
 * the sensor frame (the same beams missing or short whatever the pose); with the implausible
 * returns masked, the remaining ones must fit the map again.
 */
import { fixed } from '../flags/intervals';
import { hypot } from '../numerics';
import { measureBeamPersistence, SHORT_RANGE } from './beam-persistence';
import type { ScoredCause } from './cause-score';
import type { CauseFlag, CauseInput, CounterfactualRun } from './cause-types';
import {
  compareEvidence,
  type RunCounterfactual,
  stepAt,
  windowAround,
  windowSettings,
} from './counterfactual-runner';

/** Evidence gain (nats per measurement) with the implausible returns masked that supports a sensor fault. */
export const SENSOR_MIN_GAIN = 0.2;
/**
 * When an unmapped static object was flagged for at least this share of the interval, the masked
 * returns are taken to be that object's, not the sensor's, and the counterfactual does not count.
 */
export const SENSOR_MAX_OBJECT_SHARE = 0.5;
/** Travel (m) over the interval from which beams that stay short read as independent of the pose. */
export const SENSOR_POSE_CHANGE = 2;
/** ... when at least this share of the used beams stays short. */
export const SENSOR_MIN_SECTOR = 0.1;
/** Rise in the missing-or-short share of returns that counts as full evidence. */
const FULL_RISE = 0.5;

/** Path length (m) and summed turning (rad) of the replay's mean pose over [start, end]. */
function travelled(input: CauseInput, start: number, end: number): { metres: number; radians: number } {
  const { series } = input;
  let metres = 0;
  let radians = 0;
  for (let k = stepAt(series, start) + 1; k < series.t.length && series.t[k] <= end; k++) {
    metres += hypot(series.x[k] - series.x[k - 1], series.y[k] - series.y[k - 1]);
    let turn = series.theta[k] - series.theta[k - 1];
    if (turn > Math.PI) turn -= 2 * Math.PI;
    else if (turn < -Math.PI) turn += 2 * Math.PI;
    radians += Math.abs(turn);
  }
  return { metres, radians };
}

/** Seconds of [start, end] during which an unmapped static object (map_out_of_date) was flagged. */
function overlapWithObjects(flags: readonly CauseFlag[], start: number, end: number): number {
  let seconds = 0;
  for (const flag of flags)
    if (flag.kind === 'map_out_of_date')
      for (const seen of flag.sightings ?? [{ start: flag.start, end: flag.end }])
        seconds += Math.max(0, Math.min(end, seen.end) - Math.max(start, seen.start));
  return seconds;
}

function sensorDegraded(input: CauseInput, run: RunCounterfactual, flag: CauseFlag): ScoredCause | undefined {
  const { start, end } = flag;
  const beams = measureBeamPersistence(input.context, start, end);
  if (!beams) return undefined;
  const span = windowAround(input.series, start, end);
  const masked = {
    ...windowSettings(input, span),
    masked_beams: beams.shortSuspect,
    masked_below: SHORT_RANGE,
    mask: { start, end },
  };
  const { gain, digest } = compareEvidence(input, run, masked, start, end);
  const move = travelled(input, start, end);
  // Returns that stay short on the same beams while the robot drives on belong to the window, not
  // to an object in the world: an "unmapped object" flagged meanwhile is then not held against it.
  const isPoseIndependent =
    move.metres >= SENSOR_POSE_CHANGE && beams.shortSuspect.length >= SENSOR_MIN_SECTOR * beams.usedBeams;
  const objectShare = isPoseIndependent
    ? 0
    : overlapWithObjects(input.flags, start, end) / Math.max(1e-9, end - start);
  const counterfactual: CounterfactualRun = {
    label: `Returns shorter than ${SHORT_RANGE} m and ${beams.shortSuspect.length} persistently short beams masked over ${fixed(start)}-${fixed(end)} s`,
    settings: masked,
    digest,
    metric: 'gain in median log-likelihood per measurement over the interval (nats)',
    value: gain,
    supports: Number.isFinite(gain) && gain >= SENSOR_MIN_GAIN && objectShare < SENSOR_MAX_OBJECT_SHARE,
  };
  const missingRise = beams.missingShare - beams.missingBefore;
  const shortRise = beams.shortShare - beams.shortBefore;
  const strength = (Math.max(missingRise, shortRise, 0) / FULL_RISE) * (1 - Math.min(1, objectShare));
  const pct = (share: number) => fixed(share * 100, 0);
  return {
    kind: 'sensor_degraded',
    start,
    end,
    strength,
    evidence:
      `For ${fixed(end - start)} s ${pct(beams.missingShare)} % of returns were missing (${pct(beams.missingBefore)} % before) and ${pct(beams.shortShare)} % shorter than ${SHORT_RANGE} m (${pct(beams.shortBefore)} % before); ` +
      `${beams.suspect.length} of ${beams.usedBeams} used beams stayed bad while the robot moved ${fixed(move.metres)} m and turned ${fixed((move.radians * 180) / Math.PI, 0)}°; ` +
      `with the implausible returns masked the rest fit ${fixed(gain, 2)} nats per measurement ${gain >= 0 ? 'better' : 'worse'}.`,
    against: [
      objectShare > 0
        ? `An unmapped static object was flagged for ${fixed(objectShare * 100, 0)} % of the interval, which explains returns in world coordinates.`
        : '',
      Number.isFinite(gain) && gain >= SENSOR_MIN_GAIN
        ? ''
        : `Masking the implausible returns gained ${Number.isFinite(gain) ? fixed(gain, 2) : 'nothing measurable'} nats per measurement (at least ${SENSOR_MIN_GAIN} needed).`,
    ]
      .filter(Boolean)
      .join(' '),
    counterfactuals: [counterfactual],
    gain,
  };
}

/** Candidate sensor faults, one per sensor-evidence flag. */
export function findSensorCauses(input: CauseInput, run: RunCounterfactual): ScoredCause[] {
  const causes: ScoredCause[] = [];
  for (const flag of input.flags) {
    if (flag.kind !== 'sensor_evidence_dropped') continue;
    const cause = sensorDegraded(input, run, flag);
    if (cause) causes.push(cause);
  }
  return causes;
}
