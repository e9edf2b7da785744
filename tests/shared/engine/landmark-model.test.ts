import jStat from 'jstat';
import { describe, expect, it } from 'vitest';
import {
  accumulateDetectionLogLikelihood,
  buildLandmarkModel,
  detectionLikelihood,
} from '../../../shared/engine/landmark-model';
import { WAREHOUSE_DETECTOR } from '../../support/engine-fixtures';

const model = buildLandmarkModel(
  [
    { id: 'A', class: 'reflector', x: 3, y: 0 },
    { id: 'B', class: 'dock', x: 0, y: 4 },
    { id: 'C', class: 'column', x: 20, y: 0 },
  ],
  WAREHOUSE_DETECTOR,
);
/** Uniform clutter density over range [0, 8], bearing (-pi, pi] and 3 classes (bundle format). */
const CLUTTER = 0.05 / (8 * 2 * Math.PI * 3);

describe('landmark detection model', () => {
  it('is (1 - clutter) N(r) N(b) P(reported | true) + clutter density for the associated landmark', () => {
    // Robot at the origin facing +x; landmark A straight ahead at 3 m; a detection slightly off.
    const p = detectionLikelihood(model, 0, 0, 0, 0, 3.04, 0.02);
    const expected = 0.95 * jStat.normal.pdf(3.04, 3, 0.05) * jStat.normal.pdf(0.02, 0, 0.03) * 0.9 + CLUTTER;
    expect(p).toBeCloseTo(expected, 9);
  });

  it('uses the confusion matrix for a reported class different from the true one', () => {
    const p = detectionLikelihood(model, 0, 0, 0, 2, 4, Math.PI / 2);
    const expected = 0.95 * jStat.normal.pdf(4, 4, 0.05) * jStat.normal.pdf(0, 0, 0.03) * 0.05 + CLUTTER;
    expect(p).toBeCloseTo(expected, 9);
  });

  it('associates with the most likely landmark, and falls back to clutter beyond max_range', () => {
    const towardB = detectionLikelihood(model, 0, 0, Math.PI / 2, 1, 4, 0);
    const towardA = detectionLikelihood(model, 0, 0, 0, 1, 3, 0);
    expect(towardB).toBeGreaterThan(towardA);
    // Landmark C lies 20 m away, beyond the 8 m max_range: only clutter explains the detection.
    expect(detectionLikelihood(model, 0, 0, 0, 2, 20, 0)).toBeCloseTo(CLUTTER, 15);
  });

  it('gives every particle of a spread cloud the same log-likelihood as the single-pose model', () => {
    // The per-range loop narrows landmarks to those a bounding box of the particles can see; that
    // must not change any value. Particles spread over 10 m so landmarks enter and leave the gate.
    const n = 2001;
    const x = new Float64Array(n);
    const y = new Float64Array(n);
    const theta = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      x[i] = -2 + (10 * ((i * 7919) % n)) / n;
      y[i] = -3 + (8 * ((i * 104729) % n)) / n;
      theta[i] = -Math.PI + (2 * Math.PI * ((i * 31) % n)) / n;
    }
    for (const [reported, range, bearing] of [
      [0, 3.04, 0.02],
      [1, 4, 1.5],
      [2, 2.2, -2.9],
    ]) {
      const out = new Float64Array(n);
      accumulateDetectionLogLikelihood(model, x, y, theta, 0, n, reported, range, bearing, out);
      for (let i = 0; i < n; i++) {
        const single = Math.log(detectionLikelihood(model, x[i], y[i], theta[i], reported, range, bearing));
        if (out[i] !== single) expect({ i, value: out[i] }).toEqual({ i, value: single });
      }
      // The cloud covers poses that see a landmark (well above the clutter floor) and poses that do not.
      expect(Math.max(...out)).toBeGreaterThan(Math.log(CLUTTER) + 5);
      expect(Math.min(...out)).toBeCloseTo(Math.log(CLUTTER), 12);
    }
  });
});
