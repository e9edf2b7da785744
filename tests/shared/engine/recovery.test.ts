/**
 * Augmented MCL recovery (recovery.ts): running averages and injection probability against the
 * book's linear-space formulas, and the injection step's keyed, free-space-only, uniform-fallback
 * behaviour.
 */
import jStat from 'jstat';
import { describe, expect, it } from 'vitest';
import type { DetectionTable, Landmark, SiteMap } from '../../../shared/bundle/types';
import { CELL_FREE, CELL_OCCUPIED } from '../../../shared/bundle/types';
import { buildFreeSpace } from '../../../shared/engine/free-space';
import { buildLandmarkModel } from '../../../shared/engine/landmark-model';
import { isFreePosition } from '../../../shared/engine/measurement-sampling';
import { createRandomScratch } from '../../../shared/engine/random';
import {
  type InjectionProposal,
  injectionProbability,
  injectRandomParticles,
  updateLogAverage,
} from '../../../shared/engine/recovery';
import { buildMeasurementProposal } from '../../../shared/engine/recovery-proposal';
import { WAREHOUSE_DETECTOR } from '../../support/engine-fixtures';

describe('running averages (Thrun, Burgard, Fox, Probabilistic Robotics, 2005, Table 8.3)', () => {
  it('follows w <- w + alpha (w_avg - w) in linear space, seeded by the first value', () => {
    const values = [0.8, 1.1, 0.3, 2.5, 0.05];
    for (const alpha of [0.001, 0.1, 0.5]) {
      let linear = values[0];
      let log = updateLogAverage(Number.NEGATIVE_INFINITY, Math.log(values[0]), alpha);
      for (const value of values.slice(1)) {
        linear += alpha * (value - linear);
        log = updateLogAverage(log, Math.log(value), alpha);
      }
      expect(Math.exp(log)).toBeCloseTo(linear, 12);
    }
  });

  it('injects with probability max(0, 1 - w_fast / w_slow)', () => {
    expect(injectionProbability(Math.log(2), Math.log(0.5))).toBeCloseTo(0.75, 12);
    expect(injectionProbability(Math.log(0.5), Math.log(2))).toBe(0);
    expect(injectionProbability(Number.NEGATIVE_INFINITY, 0)).toBe(0);
  });
});

const WIDTH = 200;
const HEIGHT = 100;
const cells = new Uint8Array(WIDTH * HEIGHT).fill(CELL_FREE);
// A rack block x in [6, 14), y in [3, 5) (row 0 is the northmost row).
for (let row = HEIGHT - 50; row < HEIGHT - 30; row++)
  for (let column = 60; column < 140; column++) cells[row * WIDTH + column] = CELL_OCCUPIED;
const map: SiteMap = {
  resolution: 0.1,
  origin: [0, 0],
  width: WIDTH,
  height: HEIGHT,
  landmarks: [],
  grid: { resolution: 0.1, width: WIDTH, height: HEIGHT, origin: [0, 0], cells },
};
const space = buildFreeSpace(map);
const landmarks: Landmark[] = [
  { id: 'R1', class: 'reflector', x: 6, y: 2.8 },
  { id: 'R2', class: 'reflector', x: 14, y: 5.2 },
];
const model = buildLandmarkModel(landmarks, WAREHOUSE_DETECTOR);
const detections: DetectionTable = {
  t: new Float64Array([0]),
  classIndex: new Int32Array([0]),
  range: new Float64Array([2.5]),
  bearing: new Float64Array([0.3]),
};
const table = buildMeasurementProposal(model, detections, 0, 1);
if (!table) throw new Error('no proposal');
const proposal: InjectionProposal = { model, detections, table, grid: map.grid };

function inject(seed: number, step: number, withProposal: boolean, n = 2000) {
  const x = new Float64Array(n).fill(-1);
  const y = new Float64Array(n).fill(-1);
  const theta = new Float64Array(n);
  const count = injectRandomParticles(
    space,
    x,
    y,
    theta,
    0,
    n,
    1,
    seed,
    step,
    createRandomScratch(),
    withProposal ? proposal : undefined,
  );
  return { x, y, theta, count };
}

describe('injection', () => {
  it('places measurement-model poses on free cells only, at the detected range from a reflector', () => {
    const { x, y, count } = inject(3, 17, true);
    expect(count).toBeGreaterThan(1900);
    for (let i = 0; i < x.length; i++) {
      if (x[i] === -1) continue;
      expect(isFreePosition(map.grid, space, x[i], y[i])).toBe(true);
      const range = Math.min(...landmarks.map((l) => Math.abs(Math.hypot(l.x - x[i], l.y - y[i]) - 2.5)));
      expect(range).toBeLessThan(5 * WAREHOUSE_DETECTOR.range_sigma);
    }
  });

  it('is a function of (seed, step, particle): same keys, same poses; another step, other poses', () => {
    const first = inject(3, 17, true);
    expect(inject(3, 17, true).x).toEqual(first.x);
    expect(inject(3, 18, true).x).not.toEqual(first.x);
    expect(inject(4, 17, true).theta).not.toEqual(first.theta);
  });

  it('falls back to uniform free-space poses without a proposal (Pearson chi-square over map halves)', () => {
    const { x, y, count } = inject(9, 2, false);
    expect(count).toBe(2000);
    let west = 0;
    for (let i = 0; i < count; i++) {
      expect(isFreePosition(map.grid, space, x[i], y[i])).toBe(true);
      if (x[i] < 10) west++;
    }
    // The rack is centred on x = 10, so each half holds half the free area: expected 1000 each.
    const chiSquare = ((west - 1000) ** 2 + (count - west - 1000) ** 2) / 1000;
    expect(chiSquare).toBeLessThan(jStat.chisquare.inv(0.99, 1));
  });
});
