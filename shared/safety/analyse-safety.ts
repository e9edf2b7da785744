/**
 * Separation and stopping analysis of a finished replay: pure and deterministic, the same in the
 * CLI, the API's workers and the browser. Entry point: `analyseSafety`.
 */
import type { Bundle } from '../bundle/types';
import { SAFETY_CAUTION } from '../safety-caution';
import { analyseSafetyEvents } from './safety-events';
import type { ClearanceBasis, MinimumDistanceResult, SafetyReport } from './safety-report';
import { type BeliefSeries, computeStepSeries, medianOfThree } from './safety-series';
import { DEFAULT_SAFETY_SETTINGS, type SafetySettings } from './safety-settings';
import { ISO_13855_EDITION, minimumDistance } from './separation-formulas';

/** Numbers are kept to the millimetre (and 0.001 for probabilities); null for NaN. */
const round3 = (v: number) => (Number.isFinite(v) ? Math.round(v * 1000) / 1000 : null);
const column = (values: Float64Array) => Array.from(values, round3);

/** The clearance the robot had: the map's, unless the scan sees something `override` m nearer. */
function hadClearance(map: number, scan: number, override: number): number {
  if (Number.isNaN(map)) return scan;
  if (Number.isNaN(scan)) return map;
  return scan < map - override ? scan : map;
}

export interface SafetyInputs {
  bundle: Bundle;
  belief: BeliefSeries;
  /** Per step, the weighted share of particles overlapping an occupied cell (createContactCollector); NaN unknown. */
  gridContactShare?: Float64Array;
  settings?: Partial<SafetySettings>;
}

function protectiveDevice(bundle: Bundle): MinimumDistanceResult | null {
  const device = bundle.manifest.robot.protective_device;
  if (!device) return null;
  const { max_speed, max_decel } = bundle.manifest.robot;
  // T: the device's response time plus the machine's stopping time from its top speed.
  const stoppingPerformance = device.response_time + max_speed / max_decel;
  const result = minimumDistance({ stoppingPerformance, detectionCapability: device.detection_capability });
  return {
    edition: ISO_13855_EDITION,
    device: device.name,
    detection_capability_mm: device.detection_capability,
    stopping_performance: stoppingPerformance,
    approach_speed_mm_s: result.approachSpeed,
    intrusion_mm: result.intrusion,
    distance_mm: result.distance,
  };
}

export function analyseSafety({
  bundle,
  belief,
  gridContactShare,
  settings: overrides,
}: SafetyInputs): SafetyReport {
  const settings: SafetySettings = { ...DEFAULT_SAFETY_SETTINGS, ...overrides };
  const n = belief.t.length;
  const steps = computeStepSeries(bundle, belief, settings);
  const hadReference = new Float64Array(n);
  const hadReplay = new Float64Array(n);
  const contact = new Float64Array(n);
  const margin = new Float64Array(n);
  const marginBelieved = new Float64Array(n);
  for (let s = 0; s < n; s++) {
    hadReference[s] = steps.referenceKnown[s]
      ? hadClearance(steps.mapReference[s], steps.scan[s], settings.scan_override)
      : Number.NaN;
    hadReplay[s] = hadClearance(steps.mapReplay[s], steps.scan[s], settings.scan_override);
    const share = gridContactShare ? gridContactShare[s] : Number.NaN;
    contact[s] = steps.scan[s] <= settings.contact_scan_margin ? 1 : share;
    margin[s] = steps.aheadHad[s] - steps.stoppingDistance[s];
    marginBelieved[s] = steps.aheadBelieved[s] - steps.stoppingDistance[s];
  }
  const had = steps.hadBasis === 'reference' ? hadReference : hadReplay;
  const mapHad = steps.hadBasis === 'reference' ? steps.mapReference : steps.mapReplay;
  let best = -1;
  for (let s = 0; s < n; s++) if (Number.isFinite(had[s]) && (best < 0 || had[s] < had[best])) best = s;
  const basis: ClearanceBasis = steps.hadBasis;
  const events = analyseSafetyEvents(
    bundle,
    {
      t: belief.t,
      had,
      hadSteady: medianOfThree(had),
      mapHad,
      believed: steps.mapOnboard,
      speed: steps.speed,
      stoppingDistance: steps.stoppingDistance,
      stoppingTime: steps.stoppingTime,
      margin,
      positionUncertainty95: steps.positionUncertainty95,
    },
    settings,
  );
  const { reaction_time, max_decel, footprint } = bundle.manifest.robot;
  return {
    caution: SAFETY_CAUTION,
    settings: { ...settings, reaction_time, max_decel, footprint },
    min_clearance:
      best < 0
        ? null
        : {
            value: round3(had[best]) as number,
            t: belief.t[best],
            to: had[best] === mapHad[best] ? 'map' : 'scan',
            basis,
          },
    events,
    t: Array.from(belief.t),
    series: {
      clearance_reference: column(hadReference),
      clearance_replay: column(hadReplay),
      clearance_onboard: column(steps.mapOnboard),
      contact_probability: column(contact),
      stopping_margin: column(margin),
      clearance_scan: column(steps.scan),
      clearance_map_reference: column(steps.mapReference),
      clearance_map_replay: column(steps.mapReplay),
      speed: column(steps.speed),
      stopping_distance: column(steps.stoppingDistance),
      clearance_ahead: column(steps.aheadHad),
      stopping_margin_believed: column(marginBelieved),
      position_uncertainty_95: column(steps.positionUncertainty95),
    },
    minimum_distance: protectiveDevice(bundle),
  };
}
