/**
 * Step timing rule. Steps follow the odometry timeline: step k sits at odometry time t_k.
 * - Step 0 (t_0) takes the initial belief and every scan and detection with t <= t_0.
 * - Step k >= 1 applies the odometry increment from reading k-1 to reading k, then every scan and
 *   detection with t_{k-1} < t <= t_k, in file order (scans first, then detections).
 * Measurements after the last odometry reading are not used.
 */
import type { Bundle } from '../bundle/types';

export interface StepTimeline {
  steps: number;
  /** Scans of step k are [scanStart[k], scanStart[k + 1]); length steps + 1. */
  scanStart: Int32Array;
  /** Detections of step k are [detectionStart[k], detectionStart[k + 1]); length steps + 1. */
  detectionStart: Int32Array;
}

/** Start offsets into the sorted times `measurementTimes` for each step interval (see the rule above). */
function bucketByStep(stepTimes: Float64Array, measurementTimes: Float64Array | undefined): Int32Array {
  const steps = stepTimes.length;
  const start = new Int32Array(steps + 1);
  const times = measurementTimes ?? new Float64Array(0);
  let m = 0;
  for (let k = 0; k < steps; k++) {
    start[k] = m;
    while (m < times.length && times[m] <= stepTimes[k]) m++;
  }
  start[steps] = m;
  return start;
}

export function buildStepTimeline(bundle: Bundle): StepTimeline {
  const stepTimes = bundle.odometry.t;
  return {
    steps: stepTimes.length,
    scanStart: bucketByStep(stepTimes, bundle.scans?.t),
    detectionStart: bucketByStep(stepTimes, bundle.detections?.t),
  };
}
