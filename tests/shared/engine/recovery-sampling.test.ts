/**
 * Injected poses drawn from the landmark measurement model (measurement-sampling.ts and
 * recovery-proposal.ts). The reference is the range-bearing landmark model itself:
 *   r = sqrt((m_x - x)^2 + (m_y - y)^2),  phi = atan2(m_y - y, m_x - x) - theta
 * (Thrun, Burgard, Fox, Probabilistic Robotics, 2005, Section 6.6, landmark measurement model),
 * so a sampled pose must see its landmark at the detection's range and bearing, within the noise.
 */
import jStat from 'jstat';
import { describe, expect, it } from 'vitest';
import type { DetectionTable, Landmark, SiteMap } from '../../../shared/bundle/types';
import { CELL_FREE, CELL_OCCUPIED } from '../../../shared/bundle/types';
import { buildFreeSpace } from '../../../shared/engine/free-space';
import { buildLandmarkModel } from '../../../shared/engine/landmark-model';
import {
  drawProposalPose,
  isFreePosition,
  placeFromDetectionPair,
  placeFromSingleDetection,
} from '../../../shared/engine/measurement-sampling';
import { createRandomScratch, fillNormals, fillUniforms, RNG_PURPOSE } from '../../../shared/engine/random';
import { type BeliefPrior, buildMeasurementProposal } from '../../../shared/engine/recovery-proposal';
import { wrapAngle } from '../../../shared/engine/stats';
import { WAREHOUSE_DETECTOR } from '../../support/engine-fixtures';

const SIGMA_R = WAREHOUSE_DETECTOR.range_sigma;
const SIGMA_B = WAREHOUSE_DETECTOR.bearing_sigma;

/** Two look-alike reflector pairs 3.8 m apart vertically, 10 m apart horizontally, and a dock. */
const LANDMARKS: Landmark[] = [
  { id: 'R1', class: 'reflector', x: 5, y: 2 },
  { id: 'R2', class: 'reflector', x: 5, y: 5.8 },
  { id: 'R3', class: 'reflector', x: 15, y: 2 },
  { id: 'R4', class: 'reflector', x: 15, y: 5.8 },
  { id: 'D1', class: 'dock', x: 10, y: 9 },
];
const model = buildLandmarkModel(LANDMARKS, WAREHOUSE_DETECTOR);

/** The range and bearing (robot frame) at which a robot at (x, y, theta) sees landmark l. */
function observe(l: number, x: number, y: number, theta: number): [number, number] {
  const dx = LANDMARKS[l].x - x;
  const dy = LANDMARKS[l].y - y;
  return [Math.hypot(dx, dy), wrapAngle(Math.atan2(dy, dx) - theta)];
}

/** The landmark that best explains a detection seen from a pose (smallest normalised residual). */
function explainingLandmark(x: number, y: number, theta: number, range: number, bearing: number) {
  let best = { l: -1, miss: Number.POSITIVE_INFINITY, rangeResidual: 0, bearingResidual: 0 };
  for (let l = 0; l < LANDMARKS.length; l++) {
    const [r, b] = observe(l, x, y, theta);
    const miss = ((r - range) / SIGMA_R) ** 2 + (wrapAngle(b - bearing) / SIGMA_B) ** 2;
    if (miss < best.miss)
      best = { l, miss, rangeResidual: r - range, bearingResidual: wrapAngle(b - bearing) };
  }
  return best;
}

function detectionTable(rows: [classIndex: number, range: number, bearing: number][]): DetectionTable {
  return {
    t: new Float64Array(rows.length),
    classIndex: Int32Array.from(rows, (row) => row[0]),
    range: Float64Array.from(rows, (row) => row[1]),
    bearing: Float64Array.from(rows, (row) => row[2]),
  };
}

/** Draws n poses from a table with counter-keyed random numbers (seed 5, test purpose). */
function drawPoses(detections: DetectionTable, n: number, prior?: BeliefPrior) {
  const table = buildMeasurementProposal(model, detections, 0, detections.t.length, prior);
  if (!table) throw new Error('no proposal');
  const scratch = createRandomScratch();
  const normals = new Float64Array(4);
  const out = new Float64Array(3);
  const poses: number[][] = [];
  for (let i = 0; i < n; i++) {
    fillNormals(5, RNG_PURPOSE.test, 0, i, 1, scratch);
    normals.set(scratch.values);
    fillUniforms(5, RNG_PURPOSE.test, 0, i, 0, scratch);
    drawProposalPose(table, model, detections, scratch.values[0], scratch.values[1], normals, out);
    poses.push([out[0], out[1], out[2]]);
  }
  return { table, poses };
}

describe('pose solvers', () => {
  it('places the robot so that it sees the landmark at the given range and bearing', () => {
    const pose = new Float64Array(3);
    for (const [range, bearing, toward] of [
      [3.2, 0.4, 1.1],
      [0.8, -2.9, -3],
      [6, Math.PI, 0.2],
    ]) {
      placeFromSingleDetection(model, 2, range, bearing, toward, pose);
      const [r, b] = observe(2, pose[0], pose[1], pose[2]);
      expect(r).toBeCloseTo(range, 12);
      expect(wrapAngle(b - bearing)).toBeCloseTo(0, 12);
    }
  });

  it('recovers the exact pose from two noiseless detections of known landmarks', () => {
    const truth = [9.3, 3.1, 2.4];
    const [r1, b1] = observe(0, truth[0], truth[1], truth[2]);
    const [r2, b2] = observe(1, truth[0], truth[1], truth[2]);
    const pose = new Float64Array(3);
    placeFromDetectionPair(model, 0, 1, r1, b1, r2, b2, pose);
    expect(pose[0]).toBeCloseTo(truth[0], 10);
    expect(pose[1]).toBeCloseTo(truth[1], 10);
    expect(wrapAngle(pose[2] - truth[2])).toBeCloseTo(0, 10);
  });
});

describe('sampling from one detection', () => {
  // Robot at (10, 4) facing north sees R4 (15, 5.8); no prior: anywhere on the circles.
  const [range, bearing] = observe(3, 10, 4, Math.PI / 2);
  const detections = detectionTable([[0, range, bearing]]);
  const n = 4000;
  const { table, poses } = drawPoses(detections, n);

  it('puts each pose at the detected range from some reflector, with range residual sd sigma_r', () => {
    expect(table.isPair).toBe(false);
    const residuals = poses.map(([x, y, theta]) => {
      const { bearingResidual, rangeResidual } = explainingLandmark(x, y, theta, range, bearing);
      // Heading consistent with the detection's bearing: within 5 sigma_b.
      expect(Math.abs(bearingResidual)).toBeLessThan(5 * SIGMA_B);
      return rangeResidual;
    });
    // Sample sd of the range residual vs sigma_r: chi-square 99 % interval for n - 1 dof.
    const sd = jStat.stdev(residuals, true);
    const low = SIGMA_R * Math.sqrt(jStat.chisquare.inv(0.005, n - 1) / (n - 1));
    const high = SIGMA_R * Math.sqrt(jStat.chisquare.inv(0.995, n - 1) / (n - 1));
    expect(sd).toBeGreaterThan(low);
    expect(sd).toBeLessThan(high);
  });

  it('picks landmarks in proportion to the confusion row of the reported class', () => {
    // Reported "reflector" (row 0 of the transposed use: P(reported reflector | true class)):
    // 4 reflectors at 0.9 each and the dock at 0.1 (WAREHOUSE_DETECTOR confusion[1][0]).
    const DOCK = 4;
    const nearDock = poses.filter(
      ([x, y, theta]) => explainingLandmark(x, y, theta, range, bearing).l === DOCK,
    ).length;
    const expected = (n * 0.1) / (4 * 0.9 + 0.1);
    // Pearson chi-square on two cells (dock vs reflectors), 1 dof, 99 % (NIST/SEMATECH table: 6.635).
    const chiSquare = (nearDock - expected) ** 2 / expected + (nearDock - expected) ** 2 / (n - expected);
    expect(chiSquare).toBeLessThan(jStat.chisquare.inv(0.99, 1));
  });

  it('draws around the circle point nearest the belief mean when given a prior', () => {
    const prior = { x: 10, y: 4, theta: Math.PI / 2, sigma: 0.3, headingSigma: 0.5 };
    const { poses: near } = drawPoses(detections, 500, prior);
    const distances = near.map(([x, y]) => Math.hypot(x - prior.x, y - prior.y));
    // Most of the mass within 3 sigma of the mean (the circle passes through the truth).
    const within = distances.filter((d) => d < 3 * prior.sigma).length;
    expect(within / near.length).toBeGreaterThan(0.9);
  });
});

describe('sampling from a pair of detections', () => {
  const truth = [10, 4, Math.PI / 2];
  const [r1, b1] = observe(2, truth[0], truth[1], truth[2]);
  const [r2, b2] = observe(3, truth[0], truth[1], truth[2]);
  const detections = detectionTable([
    [0, r1, b1],
    [0, r2, b2],
  ]);

  it('offers the true pose, its look-alike one pair over and their mirror images; the prior picks the truth', () => {
    const { table, poses } = drawPoses(detections, 2000);
    expect(table.isPair).toBe(true);
    // Only pairs 3.8 m apart fit: (R1,R2), (R2,R1), (R3,R4), (R4,R3).
    expect(table.count).toBe(4);
    const nearTruth = poses.filter(([x, y]) => Math.hypot(x - truth[0], y - truth[1]) < 0.3).length;
    expect(nearTruth / poses.length).toBeGreaterThan(0.15);
    // The mirror image of (R1, R2) stands at (10, 3.8) facing south: only the heading tells it apart.
    const prior = { x: 9.6, y: 4.2, theta: 1.4, sigma: 0.5, headingSigma: 0.5 };
    const { poses: withPrior } = drawPoses(detections, 500, prior);
    // Noise bound: a bearing error of 5 sigma_b at the farther detection's range, plus 5 sigma_r.
    const bound = 5 * (Math.max(r1, r2) * SIGMA_B + SIGMA_R);
    for (const [x, y, theta] of withPrior) {
      expect(Math.hypot(x - truth[0], y - truth[1])).toBeLessThan(bound);
      expect(Math.abs(wrapAngle(theta - truth[2]))).toBeLessThan(0.3);
    }
  });
});

describe('free-space test', () => {
  const width = 40;
  const height = 20;
  const cells = new Uint8Array(width * height).fill(CELL_FREE);
  // Row 0 is the northmost row: mark the cell at x in [1, 1.5), y in [0.5, 1) occupied.
  cells[(height - 1 - 1) * width + 2] = CELL_OCCUPIED;
  const map: SiteMap = {
    resolution: 0.5,
    origin: [0, 0],
    width,
    height,
    landmarks: [],
    grid: { resolution: 0.5, width, height, origin: [0, 0], cells },
  };
  const space = buildFreeSpace(map);

  it('tells free cells from occupied ones and from points outside the map', () => {
    expect(isFreePosition(map.grid, space, 1.2, 0.7)).toBe(false);
    expect(isFreePosition(map.grid, space, 0.7, 0.7)).toBe(true);
    expect(isFreePosition(map.grid, space, -0.1, 3)).toBe(false);
    expect(isFreePosition(map.grid, space, 3, 10.01)).toBe(false);
    expect(isFreePosition(undefined, space, 19.9, 9.9)).toBe(true);
  });
});
