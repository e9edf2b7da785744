import jStat from 'jstat';
import { describe, expect, it } from 'vitest';
import {
  accumulateDetectionLogLikelihood,
  bestAssociationTerms,
  createDetectionScratch,
  detectionLikelihood,
} from '../../../shared/engine/landmark-association';
import { associationTerm, buildLandmarkModel } from '../../../shared/engine/landmark-model';
import { cos, sin } from '../../../shared/engine/numerics';
import { makeSyntheticBundle, WAREHOUSE_DETECTOR } from '../../support/engine-fixtures';

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

  it('associates through the spatial index exactly as a search over every landmark', () => {
    // Reference: exhaustive maximum-likelihood association (every landmark, no index, no gate)
    // with the same per-landmark term. The index and the gates may only skip terms too small to
    // change (1 - clutter) best + clutter density, so that sum must be bit-identical.
    // Particles spread over 10 m so landmarks enter and leave the range and bearing gates.
    const n = 2001;
    const x = new Float64Array(n);
    const y = new Float64Array(n);
    const theta = new Float64Array(n);
    const cosTheta = new Float64Array(n);
    const sinTheta = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      x[i] = -2 + (10 * ((i * 7919) % n)) / n;
      y[i] = -3 + (8 * ((i * 104729) % n)) / n;
      theta[i] = -Math.PI + (2 * Math.PI * ((i * 31) % n)) / n;
      cosTheta[i] = cos(theta[i]);
      sinTheta[i] = sin(theta[i]);
    }
    const scratch = createDetectionScratch(model, n);
    for (const [reported, range, bearing] of [
      [0, 3.04, 0.02],
      [1, 4, 1.5],
      [2, 2.2, -2.9],
      [0, 7.9, 3.1],
    ]) {
      bestAssociationTerms(
        model,
        { x, y, theta, cosTheta, sinTheta },
        0,
        n,
        reported,
        range,
        bearing,
        scratch.best,
        scratch,
      );
      let explained = 0;
      for (let i = 0; i < n; i++) {
        const ux = cosTheta[i] * cos(bearing) - sinTheta[i] * sin(bearing);
        const uy = sinTheta[i] * cos(bearing) + cosTheta[i] * sin(bearing);
        let exhaustive = 0;
        for (let l = 0; l < model.count; l++)
          exhaustive = Math.max(exhaustive, associationTerm(model, l, x[i], y[i], ux, uy, range, reported));
        const indexed = 0.95 * scratch.best[i] + CLUTTER;
        if (indexed !== 0.95 * exhaustive + CLUTTER)
          expect({ i, indexed }).toEqual({ i, indexed: 0.95 * exhaustive + CLUTTER });
        if (scratch.best[i] > CLUTTER) explained++;
      }
      // The cloud covers poses that see a landmark (well above the clutter floor) and poses that do not.
      if (range < 7) expect(explained).toBeGreaterThan(0);
      expect(explained).toBeLessThan(n);
    }
  });

  it('associates compact clouds on a landmark-rich site exactly as the exhaustive search', () => {
    // Clouds like a tracking filter's (0.3 m, 0.2 rad) around the true poses of the landmark-rich
    // synthetic log, with its recorded detections: here the index's range and bearing windows
    // leave out most landmarks, and the result must still equal the exhaustive search's.
    const bundle = makeSyntheticBundle({ seconds: 20, landmarkRich: true });
    const rich = buildLandmarkModel(bundle.map.landmarks, bundle.manifest.detector!);
    const detections = bundle.detections!;
    const reference = bundle.reference!;
    const n = 64;
    const cloud = { x: new Float64Array(n), y: new Float64Array(n), theta: new Float64Array(n) };
    const cosTheta = new Float64Array(n);
    const sinTheta = new Float64Array(n);
    const scratch = createDetectionScratch(rich, n);
    let compared = 0;
    let explained = 0;
    for (let d = 0; d < detections.t.length; d += 3) {
      const k = Math.round(detections.t[d] * 10);
      for (let i = 0; i < n; i++) {
        cloud.x[i] = reference.x[k] + 0.3 * (((i * 37) % n) / n - 0.5);
        cloud.y[i] = reference.y[k] + 0.3 * (((i * 11) % n) / n - 0.5);
        cloud.theta[i] = reference.theta[k] + 0.2 * (((i * 23) % n) / n - 0.5);
        cosTheta[i] = cos(cloud.theta[i]);
        sinTheta[i] = sin(cloud.theta[i]);
      }
      // The recorded detection, and copies pushed 4, 7 and 9.5 sigma off in range and bearing,
      // where the terms are tiny but still change the sum: the windows must not cut them off.
      const offset = [0, 4, -7, 9.5][(d / 3) % 4];
      const reported = detections.classIndex[d];
      const range = detections.range[d] + offset * rich.rangeSigma;
      const bearing = detections.bearing[d] - offset * rich.bearingSigma;
      bestAssociationTerms(
        rich,
        { ...cloud, cosTheta, sinTheta },
        0,
        n,
        reported,
        range,
        bearing,
        scratch.best,
        scratch,
      );
      const clutter = rich.clutter * rich.clutterDensity;
      for (let i = 0; i < n; i++) {
        const ux = cosTheta[i] * cos(bearing) - sinTheta[i] * sin(bearing);
        const uy = sinTheta[i] * cos(bearing) + cosTheta[i] * sin(bearing);
        let exhaustive = 0;
        for (let l = 0; l < rich.count; l++)
          exhaustive = Math.max(
            exhaustive,
            associationTerm(rich, l, cloud.x[i], cloud.y[i], ux, uy, range, reported),
          );
        const indexed = (1 - rich.clutter) * scratch.best[i] + clutter;
        const expected = (1 - rich.clutter) * exhaustive + clutter;
        if (indexed !== expected) expect({ d, i, indexed }).toEqual({ d, i, indexed: expected });
        compared++;
        if (scratch.best[i] > clutter) explained++;
      }
    }
    expect(compared).toBeGreaterThan(10_000);
    // Most cloud particles sit near the truth, so most detections are explained by a landmark.
    expect(explained / compared).toBeGreaterThan(0.3);
  });

  it('associates on a site of many landmarks, with ties and at the gate edges, exactly as the exhaustive search', () => {
    // 21 x 21 landmarks on a 1 m lattice, the class set by the column (one in seven unknown to the
    // detector). Half the particles sit halfway between two lattice rows facing +x, so the two
    // landmarks ahead are mirror images: equal range, bearing residuals of opposite sign, a tie.
    // Detections put the nearest landmark exactly at, just inside and just outside the range and
    // bearing gates, and near max_range. Reference: every landmark, no index, no gate.
    const kinds = ['reflector', 'dock', 'column', 'reflector', 'dock', 'column', 'unlisted'];
    const lattice = [];
    for (let i = 0; i <= 20; i++)
      for (let j = 0; j <= 20; j++) lattice.push({ id: `L${i}-${j}`, class: kinds[i % 7], x: i, y: j });
    const site = buildLandmarkModel(lattice, WAREHOUSE_DETECTOR);
    const n = 400;
    const poses = {
      x: new Float64Array(n),
      y: new Float64Array(n),
      theta: new Float64Array(n),
      cosTheta: new Float64Array(n),
      sinTheta: new Float64Array(n),
    };
    for (let i = 0; i < n; i++) {
      const isMirror = i % 2 === 0;
      poses.x[i] = 6 + (i % 9) + (isMirror ? 0 : 0.013 * (i % 13));
      poses.y[i] = 6 + ((i * 7) % 9) + (isMirror ? 0.5 : 0.021 * (i % 11));
      poses.theta[i] = isMirror ? 0 : 0.004 * ((i % 17) - 8);
      poses.cosTheta[i] = cos(poses.theta[i]);
      poses.sinTheta[i] = sin(poses.theta[i]);
    }
    const rangeGate = site.gateSigmas * site.rangeSigma;
    const bearingGate = site.gateSigmas * site.bearingSigma;
    const nearly = 1 - 1e-12;
    const detections: [reported: number, range: number, bearing: number][] = [
      [0, Math.hypot(1, 0.5), 0], // the mirrored pair ahead: a tie for the even particles
      [1, Math.hypot(2, 0.5), 0],
      [2, Math.hypot(1, 0.5) + rangeGate, 0],
      [0, Math.hypot(1, 0.5) + rangeGate * nearly, 0],
      [0, Math.hypot(1, 0.5) - rangeGate / nearly, 0],
      [1, 1, bearingGate],
      [1, 1, -bearingGate * nearly],
      [2, 1, bearingGate / nearly],
      [0, site.maxRange, 0.3],
      [2, site.maxRange - rangeGate, -0.2],
    ];
    const scratch = createDetectionScratch(site, n);
    const clutter = site.clutter * site.clutterDensity;
    let ties = 0;
    let explained = 0;
    for (const [reported, range, bearing] of detections) {
      bestAssociationTerms(site, poses, 0, n, reported, range, bearing, scratch.best, scratch);
      for (let i = 0; i < n; i++) {
        const ux = poses.cosTheta[i] * cos(bearing) - poses.sinTheta[i] * sin(bearing);
        const uy = poses.sinTheta[i] * cos(bearing) + poses.cosTheta[i] * sin(bearing);
        let exhaustive = 0;
        let atTop = 0;
        for (let l = 0; l < site.count; l++) {
          const term = associationTerm(site, l, poses.x[i], poses.y[i], ux, uy, range, reported);
          if (term > exhaustive) [exhaustive, atTop] = [term, 1];
          else if (term === exhaustive && term > 0) atTop++;
        }
        const indexed = (1 - site.clutter) * scratch.best[i] + clutter;
        const expected = (1 - site.clutter) * exhaustive + clutter;
        if (indexed !== expected)
          expect({ range, bearing, i, indexed }).toEqual({ range, bearing, i, indexed: expected });
        if (atTop > 1) ties++;
        if (exhaustive > 0) explained++;
      }
    }
    // The case must exercise what it claims: exact ties and detections that some landmark explains.
    expect(ties).toBeGreaterThan(100);
    expect(explained).toBeGreaterThan(n);

    // The per-step path multiplies the same factors (1 - clutter) best + clutter, then takes one log.
    const out = new Float64Array(n);
    accumulateDetectionLogLikelihood(
      site,
      poses,
      0,
      n,
      {
        classIndex: Int32Array.from(detections, ([reported]) => reported),
        range: Float64Array.from(detections, ([, range]) => range),
        bearing: Float64Array.from(detections, ([, , bearing]) => bearing),
        first: 0,
        end: detections.length,
      },
      out,
      scratch,
    );
    for (let i = 0; i < n; i += 7) {
      let logSum = 0;
      for (const [reported, range, bearing] of detections) {
        const ux = poses.cosTheta[i] * cos(bearing) - poses.sinTheta[i] * sin(bearing);
        const uy = poses.sinTheta[i] * cos(bearing) + poses.cosTheta[i] * sin(bearing);
        let exhaustive = 0;
        for (let l = 0; l < site.count; l++)
          exhaustive = Math.max(
            exhaustive,
            associationTerm(site, l, poses.x[i], poses.y[i], ux, uy, range, reported),
          );
        logSum += Math.log((1 - site.clutter) * exhaustive + clutter);
      }
      expect(out[i]).toBeCloseTo(logSum, 11);
    }
  });

  it('adds one log per particle and step equal to the sum of the per-detection logs', () => {
    const n = 3;
    const x = Float64Array.of(0, 0.05, -0.1);
    const y = Float64Array.of(0, 0.02, 0.1);
    const theta = Float64Array.of(0, 0.01, -0.02);
    const batch = {
      classIndex: Int32Array.of(0, 1, 2),
      range: Float64Array.of(3.04, 4, 12),
      bearing: Float64Array.of(0.02, 1.55, 0),
      first: 0,
      end: 3,
    };
    const out = new Float64Array(n);
    const scratch = createDetectionScratch(model, n);
    accumulateDetectionLogLikelihood(
      model,
      { x, y, theta, cosTheta: theta.map(cos), sinTheta: theta.map(sin) },
      0,
      n,
      batch,
      out,
      scratch,
    );
    for (let i = 0; i < n; i++) {
      let sum = 0;
      for (let d = 0; d < 3; d++)
        sum += Math.log(
          detectionLikelihood(
            model,
            x[i],
            y[i],
            theta[i],
            batch.classIndex[d],
            batch.range[d],
            batch.bearing[d],
          ),
        );
      expect(out[i]).toBeCloseTo(sum, 12);
    }
  });

  it('skips only terms that cannot change the result: the gate is wide enough', () => {
    // At the gate, (1 - clutter) N e^(-G^2/2) must be below half an ulp of the clutter term.
    const term = 0.95 * model.gaussianNormaliser * Math.exp(-0.5 * model.gateSigmas * model.gateSigmas);
    expect(CLUTTER + term).toBe(CLUTTER);
    // ... and not absurdly wide (about 10 sigma for this detector).
    expect(model.gateSigmas).toBeGreaterThan(8);
    expect(model.gateSigmas).toBeLessThan(12);
  });
});
