/**
 * Landmark detection model: a detection (class, range, bearing in the robot frame) is explained by
 * the most likely landmark within the detector's max_range (maximum-likelihood association), with a
 * clutter floor for spurious detections:
 *   p(z) = (1 - clutter) * max_l [ N(r; r_l, sigma_r) N(b; b_l, sigma_b) P(reported | class_l) ]
 *        + clutter / (max_range * 2 pi * classes)
 * where the second term is the uniform density over range [0, max_range], bearing (-pi, pi] and classes.
 *
 * Association is exact yet cheap: a landmark whose range or bearing residual exceeds `gateSigmas`
 * sigmas has a term so small that (1 - clutter) term + clutter density rounds to the clutter
 * density itself (see `associationGateSigmas`), so skipping it cannot change a single bit of the
 * result. The spatial index (landmark-index.ts) applies those gates to the whole particle cloud
 * before the particle loop; tests compare the result with a search over every landmark.
 */
import type { DetectorConfig, Landmark } from '../bundle/types';
import { buildLandmarkIndex, type LandmarkIndex } from './landmark-index';
import { atan, atan2, cos, exp, log, sin } from './numerics';
import { POW2, POW2_OFFSET } from './numerics/powers-of-two';
import { SMALL_ATAN_LIMIT, smallAtan } from './numerics/small-atan';

/** Landmarks and detector settings in struct-of-arrays form for the per-particle loop. */
export interface LandmarkModel {
  count: number;
  x: Float64Array;
  y: Float64Array;
  /** Class index of each landmark in `detector.classes`, -1 when the class is unknown to the detector. */
  classIndex: Int32Array;
  classCount: number;
  /** Row-major confusion, confusion[true * classCount + reported]. */
  confusion: Float64Array;
  /** Per reported class, the true classes with non-zero confusion to it. */
  sourceClasses: Int32Array[];
  rangeSigma: number;
  bearingSigma: number;
  inverseRangeSigma: number;
  inverseBearingSigma: number;
  maxRange: number;
  clutter: number;
  /** Uniform clutter density (1 / (m rad)) per class. */
  clutterDensity: number;
  /** 1 / (2 pi sigma_r sigma_b) */
  gaussianNormaliser: number;
  /** Residuals beyond this many sigmas cannot change a result (see associationGateSigmas). */
  gateSigmas: number;
  /** tan(gateSigmas sigma_b) with slack when that angle is below pi/2, else Infinity (no bearing prefilter). */
  bearingGateTangent: number;
  /** Detections per flush of the per-particle product of likelihoods into a log (no under- or overflow). */
  detectionsPerLog: number;
  index: LandmarkIndex;
}

/** Slack on the bearing prefilter's tangent, far above the rounding of the dot and cross products. */
const TANGENT_SLACK = 1e-9;

/** Half the spacing of doubles just above `value` (a positive normal double). */
function halfUlpAbove(value: number): number {
  let e = -1022;
  while (e < 1023 && POW2[POW2_OFFSET + e + 1] <= value) e++;
  return POW2[POW2_OFFSET + e - 52 - 1] ?? Number.MIN_VALUE;
}

/**
 * Residual gate G (in sigmas) from the detector: a term N exp(-G^2 / 2) P with P <= max confusion,
 * times (1 - clutter), stays below half an ulp of the clutter term (below half the smallest
 * subnormal without clutter), so adding it to the clutter term rounds back to the clutter term;
 * one extra unit in the exponent (a factor e) absorbs the rounding of the residuals themselves.
 * Without clutter, below a quarter of the smallest subnormal (log taken directly: it is not a double).
 */
export function associationGateSigmas(
  gaussianNormaliser: number,
  clutter: number,
  clutterDensity: number,
  maxConfusion: number,
): number {
  const clutterTerm = clutter * clutterDensity;
  const largest = (1 - clutter) * gaussianNormaliser * maxConfusion;
  if (!(largest > 0)) return 0;
  const logNegligible = clutterTerm > 0 ? log(halfUlpAbove(clutterTerm)) : log(Number.MIN_VALUE) - log(4);
  const logRatio = log(largest) - logNegligible;
  return logRatio > 0 ? Math.sqrt(2 * (logRatio + 1)) : 0;
}

export function buildLandmarkModel(landmarks: readonly Landmark[], detector: DetectorConfig): LandmarkModel {
  const count = landmarks.length;
  const classCount = detector.classes.length;
  const x = new Float64Array(count);
  const y = new Float64Array(count);
  const classIndex = new Int32Array(count);
  for (let l = 0; l < count; l++) {
    x[l] = landmarks[l].x;
    y[l] = landmarks[l].y;
    classIndex[l] = detector.classes.indexOf(landmarks[l].class);
  }
  const confusion = new Float64Array(classCount * classCount);
  let maxConfusion = 0;
  for (let i = 0; i < classCount; i++)
    for (let j = 0; j < classCount; j++) {
      confusion[i * classCount + j] = detector.confusion[i][j];
      maxConfusion = Math.max(maxConfusion, detector.confusion[i][j]);
    }
  const sourceClasses = Array.from({ length: classCount }, (_, reported) =>
    Int32Array.from(
      Array.from({ length: classCount }, (_, t) => t).filter((t) => confusion[t * classCount + reported] > 0),
    ),
  );
  const clutterDensity = 1 / (detector.max_range * 2 * Math.PI * classCount);
  const gaussianNormaliser = 1 / (2 * Math.PI * detector.range_sigma * detector.bearing_sigma);
  const gateSigmas = associationGateSigmas(
    gaussianNormaliser,
    detector.clutter,
    clutterDensity,
    maxConfusion,
  );
  const bearingGate = gateSigmas * detector.bearing_sigma;
  const clutterTerm = detector.clutter * clutterDensity;
  const largestFactor = (1 - detector.clutter) * gaussianNormaliser * maxConfusion + clutterTerm;
  const widestLog = Math.max(
    1,
    clutterTerm > 0 ? -log(clutterTerm) : 0,
    largestFactor > 0 ? log(largestFactor) : 0,
  );
  return {
    count,
    x,
    y,
    classIndex,
    classCount,
    confusion,
    sourceClasses,
    rangeSigma: detector.range_sigma,
    bearingSigma: detector.bearing_sigma,
    inverseRangeSigma: 1 / detector.range_sigma,
    inverseBearingSigma: 1 / detector.bearing_sigma,
    maxRange: detector.max_range,
    clutter: detector.clutter,
    clutterDensity,
    gaussianNormaliser,
    gateSigmas,
    bearingGateTangent:
      bearingGate < 1.5
        ? (sin(bearingGate) / cos(bearingGate)) * (1 + TANGENT_SLACK)
        : Number.POSITIVE_INFINITY,
    // A product of this many factors stays within about e^+-690, inside the double range.
    detectionsPerLog: clutterTerm > 0 ? Math.max(1, Math.floor(690 / widestLog)) : 1,
    index: buildLandmarkIndex(x, y, classIndex, classCount, detector.max_range),
  };
}

/** Bearing residual (rad, in [-pi, pi]) from the cross and dot products of landmark direction and detection direction. */
export function bearingResidual(cross: number, dot: number): number {
  if (dot > 0) {
    const t = cross / dot;
    return t <= SMALL_ATAN_LIMIT && t >= -SMALL_ATAN_LIMIT ? smallAtan(t) : atan(t);
  }
  return atan2(cross, dot);
}

/**
 * The association term N(r; r_l) N(b; b_l) P(reported | class_l) from the range residual (m) and
 * the cross and dot products of the landmark direction with the detection's map-frame direction.
 */
export function termFromResiduals(
  model: LandmarkModel,
  trueClass: number,
  reportedClass: number,
  rangeResidual: number,
  cross: number,
  dot: number,
): number {
  const r = rangeResidual * model.inverseRangeSigma;
  const b = bearingResidual(cross, dot) * model.inverseBearingSigma;
  return (
    model.gaussianNormaliser *
    exp(-0.5 * (r * r + b * b)) *
    model.confusion[trueClass * model.classCount + reportedClass]
  );
}

/**
 * The association term of landmark l for a robot at (px, py) whose detection points along the
 * map-frame unit vector (ux, uy); 0 beyond max_range or for a class unknown to the detector.
 * The gated, indexed loop computes the same expression for every landmark it keeps.
 */
export function associationTerm(
  model: LandmarkModel,
  l: number,
  px: number,
  py: number,
  ux: number,
  uy: number,
  range: number,
  reportedClass: number,
): number {
  const trueClass = model.classIndex[l];
  if (trueClass < 0) return 0;
  const dx = model.x[l] - px;
  const dy = model.y[l] - py;
  const distanceSquared = dx * dx + dy * dy;
  if (distanceSquared > model.maxRange * model.maxRange) return 0;
  const rangeResidual = range - Math.sqrt(distanceSquared);
  return termFromResiduals(
    model,
    trueClass,
    reportedClass,
    rangeResidual,
    dx * uy - dy * ux,
    dx * ux + dy * uy,
  );
}
