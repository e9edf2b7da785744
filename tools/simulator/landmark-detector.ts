import { normalizeAngle, type Pose } from './pose-math';
import type { RandomSource } from './random-source';
import { castRay } from './ray-cast';
import type { SimGrid } from './sim-grid';
import type { SiteLandmark } from './site-layout';

/** The manifest's `detector` block. */
export interface DetectorSettings {
  classes: string[];
  confusion: number[][];
  range_sigma: number;
  bearing_sigma: number;
  max_range: number;
  clutter: number;
}

export interface Detection {
  classIndex: number;
  /** m, from the robot's pose */
  range: number;
  /** rad, robot frame */
  bearing: number;
}

/** Half-width (rad) of the detector's field of view, centred on the robot's heading. */
export const DETECTOR_HALF_FOV = 2.0;
/** Probability that a visible landmark is picked up in a given frame. */
const DETECTION_PROBABILITY = 0.9;
/** A landmark sits on an obstacle's face or inside it (column centre): allow this much in front. */
const VISIBILITY_MARGIN = 0.35;

/** Reported class for a landmark of true class `trueClass`, drawn from its confusion row. */
export function sampleReportedClass(confusion: number[][], trueClass: number, random: RandomSource): number {
  return random.categorical(confusion[trueClass]);
}

/**
 * Detections in one frame: each landmark within max range, inside the field of view and not
 * hidden behind another obstacle is seen with range/bearing noise and a class from the
 * confusion matrix; spurious detections are added so that on average a fraction `clutter` of all
 * detections is clutter, uniform over range [0, max_range], bearing and classes (as the format's
 * likelihood assumes).
 */
export function simulateDetections(
  grid: SimGrid,
  landmarks: readonly SiteLandmark[],
  robot: Pose,
  settings: DetectorSettings,
  random: RandomSource,
): Detection[] {
  const detections: Detection[] = [];
  for (const landmark of landmarks) {
    const range = Math.hypot(landmark.x - robot.x, landmark.y - robot.y);
    if (range > settings.max_range || range < 0.1) continue;
    const worldAngle = Math.atan2(landmark.y - robot.y, landmark.x - robot.x);
    const bearing = normalizeAngle(worldAngle - robot.theta);
    if (Math.abs(bearing) > DETECTOR_HALF_FOV) continue;
    const hit = castRay(grid, robot.x, robot.y, worldAngle, settings.max_range + 1);
    if (hit < range - VISIBILITY_MARGIN) continue;
    if (!random.chance(DETECTION_PROBABILITY)) continue;
    const trueClass = settings.classes.indexOf(landmark.class);
    detections.push({
      classIndex: sampleReportedClass(settings.confusion, trueClass, random),
      range: Math.max(0, range + settings.range_sigma * random.standardNormal()),
      bearing: normalizeAngle(bearing + settings.bearing_sigma * random.standardNormal()),
    });
  }
  const clutterOdds = settings.clutter / (1 - settings.clutter);
  const realCount = detections.length;
  for (let i = 0; i < Math.max(realCount, 1); i++) {
    if (!random.chance(clutterOdds)) continue;
    detections.push({
      classIndex: Math.floor(random.uniform() * settings.classes.length),
      range: random.uniformBetween(0, settings.max_range),
      bearing: random.uniformBetween(-DETECTOR_HALF_FOV, DETECTOR_HALF_FOV),
    });
  }
  return detections.sort((a, b) => a.bearing - b.bearing);
}
