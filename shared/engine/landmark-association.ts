/**
 * Maximum-likelihood association of detections with landmarks for a range of particles (see
 * landmark-model.ts for the model and why its gates are exact): the cloud's bounding box and
 * heading spread narrow the landmarks through the spatial index once per detection, then each
 * particle looks only at the few candidates left.
 */
import { queryLandmarks } from './landmark-index';
import { bearingResidual, type LandmarkModel, termFromResiduals } from './landmark-model';
import { exp, log, sinCos } from './numerics';

/** The particles' poses and the cos/sin of their headings (map frame, m and rad). */
export interface PoseArrays {
  x: Float64Array;
  y: Float64Array;
  theta: Float64Array;
  cosTheta: Float64Array;
  sinTheta: Float64Array;
}

/** Per-thread buffers of the detection stage. */
export interface DetectionScratch {
  candidates: Int32Array;
  /** Per-particle running product of detection likelihoods, flushed into the log-likelihood. */
  product: Float64Array;
  /** Per-particle best association term of the detection being applied. */
  best: Float64Array;
  trig: Float64Array;
}

export function createDetectionScratch(model: LandmarkModel | undefined, capacity: number): DetectionScratch {
  return {
    candidates: new Int32Array(model?.count ?? 0),
    product: new Float64Array(model ? capacity : 0),
    best: new Float64Array(model ? capacity : 0),
    trig: new Float64Array(2),
  };
}

/** The detections of one step, struct-of-arrays, and the index range [first, end) of those to apply. */
export interface DetectionBatch {
  classIndex: Int32Array;
  range: Float64Array;
  bearing: Float64Array;
  first: number;
  end: number;
}

/**
 * Writes to best[i] (i in [from, to)) the best association term max_l of one detection, through
 * the spatial index and the exact gates. cosTheta/sinTheta hold each particle's heading cos/sin.
 */
export function bestAssociationTerms(
  model: LandmarkModel,
  poses: PoseArrays,
  from: number,
  to: number,
  reportedClass: number,
  range: number,
  bearing: number,
  best: Float64Array,
  scratch: DetectionScratch,
): void {
  if (to <= from) return;
  const cloud = cloudBounds(poses, from, to);
  bestTermsForCloud(model, poses, from, to, cloud, reportedClass, range, bearing, best, scratch);
}

interface CloudBounds {
  minX: number;
  maxX: number;
  minY: number;
  maxY: number;
  headingRef: number;
  headingSpread: number;
}

function cloudBounds({ x, y, theta }: PoseArrays, from: number, to: number): CloudBounds {
  let minX = x[from];
  let maxX = minX;
  let minY = y[from];
  let maxY = minY;
  const headingRef = theta[from];
  let headingSpread = 0;
  for (let i = from + 1; i < to; i++) {
    const px = x[i];
    const py = y[i];
    if (px < minX) minX = px;
    if (px > maxX) maxX = px;
    if (py < minY) minY = py;
    if (py > maxY) maxY = py;
    let d = theta[i] - headingRef;
    if (d > Math.PI) d -= 2 * Math.PI;
    else if (d <= -Math.PI) d += 2 * Math.PI;
    const a = Math.abs(d);
    if (a > headingSpread) headingSpread = a;
  }
  return { minX, maxX, minY, maxY, headingRef, headingSpread };
}

function bestTermsForCloud(
  model: LandmarkModel,
  poses: PoseArrays,
  from: number,
  to: number,
  cloud: CloudBounds,
  reportedClass: number,
  range: number,
  bearing: number,
  best: Float64Array,
  scratch: DetectionScratch,
): void {
  const rangeGate = model.gateSigmas * model.rangeSigma;
  const candidates = scratch.candidates;
  const count = queryLandmarks(
    model.index,
    model.x,
    model.y,
    {
      classes: model.sourceClasses[reportedClass] ?? [],
      boxMinX: cloud.minX,
      boxMaxX: cloud.maxX,
      boxMinY: cloud.minY,
      boxMaxY: cloud.maxY,
      lower: Math.max(0, range - rangeGate),
      upper: Math.min(model.maxRange, range + rangeGate),
      bearing,
      headingRef: cloud.headingRef,
      headingSpread: cloud.headingSpread,
      bearingGate: model.gateSigmas * model.bearingSigma,
    },
    candidates,
  );
  if (count === 0) {
    best.fill(0, from, to);
    return;
  }
  sinCos(bearing, scratch.trig);
  const sinB = scratch.trig[0];
  const cosB = scratch.trig[1];
  if (count === 1) {
    bestTermsForOneLandmark(model, poses, from, to, candidates[0], reportedClass, range, sinB, cosB, best);
    return;
  }
  const tangent = model.bearingGateTangent;
  const maxRangeSquared = model.maxRange * model.maxRange;
  const { x, y, cosTheta, sinTheta } = poses;
  for (let i = from; i < to; i++) {
    const px = x[i];
    const py = y[i];
    const c = cosTheta[i];
    const s = sinTheta[i];
    // The detection's direction in the map frame: the heading rotated by the bearing.
    const ux = c * cosB - s * sinB;
    const uy = s * cosB + c * sinB;
    let top = 0;
    for (let k = 0; k < count; k++) {
      const l = candidates[k];
      const dx = model.x[l] - px;
      const dy = model.y[l] - py;
      const distanceSquared = dx * dx + dy * dy;
      if (distanceSquared > maxRangeSquared) continue;
      const residual = range - Math.sqrt(distanceSquared);
      if (residual > rangeGate || residual < -rangeGate) continue;
      const dot = dx * ux + dy * uy;
      const cross = dx * uy - dy * ux;
      if (tangent !== Number.POSITIVE_INFINITY && (dot <= 0 || Math.abs(cross) > tangent * dot)) continue;
      const term = termFromResiduals(model, model.classIndex[l], reportedClass, residual, cross, dot);
      if (term > top) top = term;
    }
    best[i] = top;
  }
}

/**
 * The loop above for the usual case of one candidate (a landmark-rich site still has one landmark
 * of a class within a detection's gates): the landmark's position and its confusion factor are
 * read once, not per particle, and termFromResiduals is written out with the same operations in
 * the same order, so every term has the same bits as the general loop's.
 */
function bestTermsForOneLandmark(
  model: LandmarkModel,
  { x, y, cosTheta, sinTheta }: PoseArrays,
  from: number,
  to: number,
  landmark: number,
  reportedClass: number,
  range: number,
  sinB: number,
  cosB: number,
  best: Float64Array,
): void {
  const rangeGate = model.gateSigmas * model.rangeSigma;
  const tangent = model.bearingGateTangent;
  const maxRangeSquared = model.maxRange * model.maxRange;
  const lx = model.x[landmark];
  const ly = model.y[landmark];
  const normaliser = model.gaussianNormaliser;
  const confusion = model.confusion[model.classIndex[landmark] * model.classCount + reportedClass];
  const inverseRangeSigma = model.inverseRangeSigma;
  const inverseBearingSigma = model.inverseBearingSigma;
  const gateBearing = tangent !== Number.POSITIVE_INFINITY;
  for (let i = from; i < to; i++) {
    const c = cosTheta[i];
    const s = sinTheta[i];
    const ux = c * cosB - s * sinB;
    const uy = s * cosB + c * sinB;
    const dx = lx - x[i];
    const dy = ly - y[i];
    const distanceSquared = dx * dx + dy * dy;
    best[i] = 0;
    if (distanceSquared > maxRangeSquared) continue;
    const residual = range - Math.sqrt(distanceSquared);
    if (residual > rangeGate || residual < -rangeGate) continue;
    const dot = dx * ux + dy * uy;
    const cross = dx * uy - dy * ux;
    if (gateBearing && (dot <= 0 || Math.abs(cross) > tangent * dot)) continue;
    const r = residual * inverseRangeSigma;
    const b = bearingResidual(cross, dot) * inverseBearingSigma;
    const term = normaliser * exp(-0.5 * (r * r + b * b)) * confusion;
    if (term > 0) best[i] = term;
  }
}

/**
 * Adds log p(detection | particle pose) of the detections [batch.first, batch.end) to out[i] for
 * particles [from, to). The likelihoods are multiplied per particle and turned into a log every
 * `detectionsPerLog` detections (one log per particle and step instead of one per detection).
 */
export function accumulateDetectionLogLikelihood(
  model: LandmarkModel,
  poses: PoseArrays,
  from: number,
  to: number,
  batch: DetectionBatch,
  out: Float64Array,
  scratch: DetectionScratch,
): void {
  if (to <= from || batch.end <= batch.first) return;
  const best = scratch.best;
  const cloud = cloudBounds(poses, from, to);
  const hitWeight = 1 - model.clutter;
  const clutterTerm = model.clutter * model.clutterDensity;
  const product = scratch.product;
  product.fill(1, from, to);
  let pending = 0;
  for (let d = batch.first; d < batch.end; d++) {
    const reported = batch.classIndex[d];
    bestTermsForCloud(
      model,
      poses,
      from,
      to,
      cloud,
      reported,
      batch.range[d],
      batch.bearing[d],
      best,
      scratch,
    );
    for (let i = from; i < to; i++) product[i] *= hitWeight * best[i] + clutterTerm;
    if (++pending === model.detectionsPerLog || d === batch.end - 1) {
      for (let i = from; i < to; i++) out[i] += log(product[i]);
      product.fill(1, from, to);
      pending = 0;
    }
  }
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
  const trig = new Float64Array(2);
  sinCos(poseTheta, trig);
  const scratch = createDetectionScratch(model, 1);
  const poses: PoseArrays = {
    x: Float64Array.of(poseX),
    y: Float64Array.of(poseY),
    theta: Float64Array.of(poseTheta),
    cosTheta: Float64Array.of(trig[1]),
    sinTheta: Float64Array.of(trig[0]),
  };
  bestAssociationTerms(model, poses, 0, 1, reportedClass, range, bearing, scratch.best, scratch);
  return (1 - model.clutter) * scratch.best[0] + model.clutter * model.clutterDensity;
}
