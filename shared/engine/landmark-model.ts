/**
 * Landmark detection model: a detection (class, range, bearing in the robot frame) is explained by
 * the most likely landmark within the detector's max_range (maximum-likelihood association), with a
 * clutter floor for spurious detections:
 *   p(z) = (1 - clutter) * max_l [ N(r; r_l, sigma_r) N(b; b_l, sigma_b) P(reported | class_l) ]
 *        + clutter / (max_range * 2 pi * classes)
 * where the second term is the uniform density over range [0, max_range], bearing (-pi, pi] and classes.
 */
import type { DetectorConfig, Landmark } from '../bundle/types';

/**
 * Range residuals beyond this many sigmas are skipped: their Gaussian factor is below e^-32, far
 * under the clutter floor, so skipping changes nothing measurable and saves an atan2 per landmark.
 */
export const RANGE_GATE_SIGMAS = 8;

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
  rangeSigma: number;
  bearingSigma: number;
  maxRange: number;
  clutter: number;
  /** Uniform clutter density (1 / (m rad)) per class. */
  clutterDensity: number;
  /** 1 / (2 pi sigma_r sigma_b) */
  gaussianNormaliser: number;
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
  for (let i = 0; i < classCount; i++)
    for (let j = 0; j < classCount; j++) confusion[i * classCount + j] = detector.confusion[i][j];
  return {
    count,
    x,
    y,
    classIndex,
    classCount,
    confusion,
    rangeSigma: detector.range_sigma,
    bearingSigma: detector.bearing_sigma,
    maxRange: detector.max_range,
    clutter: detector.clutter,
    clutterDensity: 1 / (detector.max_range * 2 * Math.PI * classCount),
    gaussianNormaliser: 1 / (2 * Math.PI * detector.range_sigma * detector.bearing_sigma),
  };
}

/**
 * Best association term max_l N(r) N(b) P(reported | class_l) for a robot at (poseX, poseY,
 * poseTheta) over the landmarks candidates[0..candidateCount). A landmark is considered when its
 * distance d satisfies d <= max_range and |r - d| <= RANGE_GATE_SIGMAS sigma_r, tested on d^2
 * against [lowerSquared, upperSquared].
 */
function bestAssociation(
  model: LandmarkModel,
  candidates: Int32Array,
  candidateCount: number,
  poseX: number,
  poseY: number,
  poseTheta: number,
  reportedClass: number,
  range: number,
  bearing: number,
  lowerSquared: number,
  upperSquared: number,
): number {
  const inverseRangeVariance = 1 / (model.rangeSigma * model.rangeSigma);
  const inverseBearingVariance = 1 / (model.bearingSigma * model.bearingSigma);
  let best = 0;
  for (let c = 0; c < candidateCount; c++) {
    const l = candidates[c];
    const dx = model.x[l] - poseX;
    const dy = model.y[l] - poseY;
    const distanceSquared = dx * dx + dy * dy;
    if (distanceSquared > upperSquared || distanceSquared < lowerSquared) continue;
    const trueClass = model.classIndex[l];
    const rangeResidual = range - Math.sqrt(distanceSquared);
    let bearingResidual = bearing - (Math.atan2(dy, dx) - poseTheta);
    if (bearingResidual > Math.PI || bearingResidual <= -Math.PI) {
      bearingResidual -= 2 * Math.PI * Math.round(bearingResidual / (2 * Math.PI));
    }
    const exponent =
      -0.5 *
      (rangeResidual * rangeResidual * inverseRangeVariance +
        bearingResidual * bearingResidual * inverseBearingVariance);
    const p =
      model.gaussianNormaliser *
      Math.exp(exponent) *
      model.confusion[trueClass * model.classCount + reportedClass];
    if (p > best) best = p;
  }
  return best;
}

/** Squared distance window [lower, upper] (m^2) passed by the range gate and max_range. */
function gateWindow(model: LandmarkModel, range: number): [number, number] {
  const gate = RANGE_GATE_SIGMAS * model.rangeSigma;
  const lower = Math.max(0, range - gate);
  const upper = Math.min(model.maxRange, range + gate);
  return [lower * lower, upper * upper];
}

/**
 * Writes to `candidates` the landmarks of known class whose squared distance to some point of the
 * box [minX, maxX] x [minY, maxY] (m) can fall in [lowerSquared, upperSquared], and returns how
 * many. The box bounds use the same subtractions and squares as the per-particle gate, and rounded
 * arithmetic is monotone, so every landmark a particle in the box would pass is kept: filtering
 * changes no result, it only spares the per-particle loop the landmarks no particle can see.
 */
function gateCandidates(
  model: LandmarkModel,
  minX: number,
  maxX: number,
  minY: number,
  maxY: number,
  lowerSquared: number,
  upperSquared: number,
  candidates: Int32Array,
): number {
  let count = 0;
  for (let l = 0; l < model.count; l++) {
    if (model.classIndex[l] < 0) continue;
    const lx = model.x[l];
    const ly = model.y[l];
    const nearX = lx < minX ? lx - minX : lx > maxX ? lx - maxX : 0;
    const nearY = ly < minY ? ly - minY : ly > maxY ? ly - maxY : 0;
    const farX = Math.max(Math.abs(lx - minX), Math.abs(lx - maxX));
    const farY = Math.max(Math.abs(ly - minY), Math.abs(ly - maxY));
    if (nearX * nearX + nearY * nearY > upperSquared) continue;
    if (farX * farX + farY * farY < lowerSquared) continue;
    candidates[count++] = l;
  }
  return count;
}

/**
 * Likelihood (density, 1 / (m rad) per class) of one detection (reported class index, range m,
 * bearing rad in the robot frame) for a robot at pose (x, y, theta), map frame.
 */
export function detectionLikelihood(
  model: LandmarkModel,
  poseX: number,
  poseY: number,
  poseTheta: number,
  reportedClass: number,
  range: number,
  bearing: number,
): number {
  const [lower, upper] = gateWindow(model, range);
  const candidates = new Int32Array(model.count);
  const count = gateCandidates(model, poseX, poseX, poseY, poseY, lower, upper, candidates);
  const best = bestAssociation(
    model,
    candidates,
    count,
    poseX,
    poseY,
    poseTheta,
    reportedClass,
    range,
    bearing,
    lower,
    upper,
  );
  return (1 - model.clutter) * best + model.clutter * model.clutterDensity;
}

/**
 * Adds log p(detection | particle pose) to out[i] for particles [from, to). Landmarks are first
 * narrowed to those within the gate of the particles' bounding box (see gateCandidates).
 */
export function accumulateDetectionLogLikelihood(
  model: LandmarkModel,
  x: Float64Array,
  y: Float64Array,
  theta: Float64Array,
  from: number,
  to: number,
  reportedClass: number,
  range: number,
  bearing: number,
  out: Float64Array,
): void {
  if (to <= from) return;
  const [lower, upper] = gateWindow(model, range);
  let minX = x[from];
  let maxX = minX;
  let minY = y[from];
  let maxY = minY;
  for (let i = from + 1; i < to; i++) {
    const px = x[i];
    const py = y[i];
    if (px < minX) minX = px;
    if (px > maxX) maxX = px;
    if (py < minY) minY = py;
    if (py > maxY) maxY = py;
  }
  const candidates = new Int32Array(model.count);
  const count = gateCandidates(model, minX, maxX, minY, maxY, lower, upper, candidates);
  const hitWeight = 1 - model.clutter;
  const clutterTerm = model.clutter * model.clutterDensity;
  for (let i = from; i < to; i++) {
    const best = bestAssociation(
      model,
      candidates,
      count,
      x[i],
      y[i],
      theta[i],
      reportedClass,
      range,
      bearing,
      lower,
      upper,
    );
    out[i] += Math.log(hitWeight * best + clutterTerm);
  }
}
