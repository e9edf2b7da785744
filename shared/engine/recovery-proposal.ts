/**
 * The association table a recovery step draws injected poses from (see measurement-sampling.ts).
 *
 * Each entry explains the step's detections by landmarks, with a probability:
 * - PAIR: detections (i, j) by landmarks (a, b), weight
 *   P(c_i | class_a) P(c_j | class_b) N(|L_a - L_b|; |p_i - p_j|, sigma_pair), p being the
 *   detection's point in the robot frame. Two points fix the whole pose.
 * - SINGLE (no consistent pair: one detection, or clutter): detection i by landmark a, weight
 *   P(c_i | class_a); the pose lies on the circle of the measured range around L_a.
 *
 * Weighting by the belief (dual MCL, Thrun, Fox, Burgard & Dellaert 2001): the book's augmented MCL
 * re-weights injected particles only at the next measurement, so in a warehouse of repeated aisles a
 * pose one aisle over, which explains scans and detections as well as the true one, wins as often
 * as the truth. Mixture MCL weights each pose drawn from p(z | x) by the predicted belief at x; we
 * use a smoothed belief, a Gaussian around the belief's mean pose whose spreads are the belief's own
 * plus how far an unnoticed push or slip can carry the robot between measurements (recovery.ts),
 * instead of a density tree. Entries are multiplied by it, and single-detection
 * angles are drawn around the point of the circle nearest the mean.
 */

import type { DetectionTable } from '../bundle/types';
import type { LandmarkModel } from './landmark-model';
import { detectionPoint, placeFromDetectionPair } from './measurement-sampling';
import { atan2, exp, hypot } from './numerics';
import { wrapAngle } from './stats';

/** Pair entries lighter than this fraction of the heaviest are dropped (inconsistent geometry). */
const PAIR_WEIGHT_FLOOR = 1e-6;
/** Pairs whose landmark separation is more than this many spreads from the detections' are skipped. */
const PAIR_GATE = 4;

/** Smoothed predicted belief used to weight proposals: mean pose (m, rad, map frame) and spreads. */
export interface BeliefPrior {
  x: number;
  y: number;
  theta: number;
  /** Isotropic position sigma, m. */
  sigma: number;
  /** Heading sigma, rad. */
  headingSigma: number;
}

/** The step's association table, struct-of-arrays; see the file comment. */
export interface MeasurementProposal {
  count: number;
  /** True when the entries are detection pairs, false for single detections. */
  isPair: boolean;
  detectionI: Int32Array;
  detectionJ: Int32Array;
  landmarkA: Int32Array;
  landmarkB: Int32Array;
  /** Single entries with a prior: map direction (rad) from the robot to L_a at the circle point nearest the mean. */
  nearestAngle: Float64Array;
  /** Single entries with a prior: spread (rad) of the angle around `nearestAngle`; 0 = uniform angle. */
  angleSigma: Float64Array;
  /** Cumulative, normalised weights; the last is 1. */
  cumulative: Float64Array;
}

interface Entry {
  i: number;
  j: number;
  a: number;
  b: number;
  weight: number;
  nearestAngle: number;
  angleSigma: number;
}

function confusionWeight(model: LandmarkModel, landmark: number, reportedClass: number): number {
  const trueClass = model.classIndex[landmark];
  if (trueClass < 0 || reportedClass < 0) return 0;
  return model.confusion[trueClass * model.classCount + reportedClass];
}

function gaussianFactor(distance: number, sigma: number): number {
  return exp((-0.5 * distance * distance) / (sigma * sigma));
}

/**
 * Builds the table for detections [from, to). Returns undefined when the step has no detection, no
 * landmark of a reportable class, or (with a prior) no explanation with weight near the belief.
 */
export function buildMeasurementProposal(
  model: LandmarkModel,
  detections: DetectionTable,
  from: number,
  to: number,
  prior?: BeliefPrior,
): MeasurementProposal | undefined {
  if (to <= from || model.count === 0) return undefined;
  return (
    finishTable(pairEntries(model, detections, from, to, prior), true) ??
    finishTable(singleEntries(model, detections, from, to, prior), false)
  );
}

function pairEntries(
  model: LandmarkModel,
  detections: DetectionTable,
  from: number,
  to: number,
  prior: BeliefPrior | undefined,
): Entry[] {
  const entries: Entry[] = [];
  const pose = new Float64Array(3);
  const { range, bearing, classIndex } = detections;
  for (let i = from; i < to; i++) {
    for (let j = i + 1; j < to; j++) {
      const [xi, yi] = detectionPoint(range[i], bearing[i]);
      const [xj, yj] = detectionPoint(range[j], bearing[j]);
      const separation = hypot(xj - xi, yj - yi);
      // First-order spread of |p_i - p_j| from both detections' range and bearing noise (an upper bound).
      const spread = Math.sqrt(
        2 * model.rangeSigma * model.rangeSigma +
          (range[i] * range[i] + range[j] * range[j]) * model.bearingSigma * model.bearingSigma,
      );
      for (let a = 0; a < model.count; a++) {
        const weightA = confusionWeight(model, a, classIndex[i]);
        if (weightA === 0) continue;
        for (let b = 0; b < model.count; b++) {
          const weightB = b === a ? 0 : confusionWeight(model, b, classIndex[j]);
          if (weightB === 0) continue;
          const residual = hypot(model.x[b] - model.x[a], model.y[b] - model.y[a]) - separation;
          if (Math.abs(residual) > PAIR_GATE * spread) continue;
          let weight = weightA * weightB * gaussianFactor(residual, spread);
          if (prior) {
            placeFromDetectionPair(model, a, b, range[i], bearing[i], range[j], bearing[j], pose);
            weight *=
              gaussianFactor(hypot(pose[0] - prior.x, pose[1] - prior.y), prior.sigma) *
              gaussianFactor(wrapAngle(pose[2] - prior.theta), prior.headingSigma);
          }
          entries.push({ i, j, a, b, weight, nearestAngle: 0, angleSigma: 0 });
        }
      }
    }
  }
  let heaviest = 0;
  for (const entry of entries) heaviest = Math.max(heaviest, entry.weight);
  return entries.filter((entry) => entry.weight >= PAIR_WEIGHT_FLOOR * heaviest);
}

function singleEntries(
  model: LandmarkModel,
  detections: DetectionTable,
  from: number,
  to: number,
  prior: BeliefPrior | undefined,
): Entry[] {
  const entries: Entry[] = [];
  for (let i = from; i < to; i++) {
    const range = detections.range[i];
    for (let a = 0; a < model.count; a++) {
      let weight = confusionWeight(model, a, detections.classIndex[i]);
      if (weight === 0) continue;
      let nearestAngle = 0;
      let angleSigma = 0;
      if (prior) {
        // The circle point nearest the mean lies on the line from L_a through the mean.
        const toMean = hypot(prior.x - model.x[a], prior.y - model.y[a]);
        nearestAngle = atan2(model.y[a] - prior.y, model.x[a] - prior.x);
        angleSigma = prior.sigma / Math.max(range, model.rangeSigma);
        const heading = wrapAngle(nearestAngle - detections.bearing[i]);
        weight *=
          gaussianFactor(toMean - range, prior.sigma) *
          gaussianFactor(wrapAngle(heading - prior.theta), prior.headingSigma);
      }
      entries.push({ i, j: i, a, b: a, weight, nearestAngle, angleSigma });
    }
  }
  return entries;
}

function finishTable(entries: Entry[], isPair: boolean): MeasurementProposal | undefined {
  let total = 0;
  for (const entry of entries) total += entry.weight;
  if (!(total > 0)) return undefined;
  const count = entries.length;
  const table: MeasurementProposal = {
    count,
    isPair,
    detectionI: Int32Array.from(entries, (entry) => entry.i),
    detectionJ: Int32Array.from(entries, (entry) => entry.j),
    landmarkA: Int32Array.from(entries, (entry) => entry.a),
    landmarkB: Int32Array.from(entries, (entry) => entry.b),
    nearestAngle: Float64Array.from(entries, (entry) => entry.nearestAngle),
    angleSigma: Float64Array.from(entries, (entry) => entry.angleSigma),
    cumulative: new Float64Array(count),
  };
  let running = 0;
  for (let k = 0; k < count; k++) {
    running += entries[k].weight;
    table.cumulative[k] = running / total;
  }
  table.cumulative[count - 1] = 1;
  return table;
}
