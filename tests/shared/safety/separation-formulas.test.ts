import { describe, expect, it } from 'vitest';
import { minimumDistance, protectiveSeparationDistance } from '../../../shared/safety/separation-formulas';

describe('ISO 13855:2010 minimum distance S = K T + C', () => {
  it('reproduces the worked example of safety-device manuals: T = 0.32 s, d = 14 mm gives 640 mm, then 512 mm', () => {
    // Worked example as published in safety light curtain manuals citing ISO 13855 clause 6.2.3:
    // S = 2000 * 0.32 + 8 (14 - 14) = 640 mm > 500 mm, so recompute with K = 1600: 512 mm (not below 500).
    const result = minimumDistance({ stoppingPerformance: 0.32, detectionCapability: 14 });
    expect(result.distanceAtK2000).toBeCloseTo(640, 9);
    expect(result.approachSpeed).toBe(1600);
    expect(result.intrusion).toBe(0);
    expect(result.distance).toBeCloseTo(512, 9);
  });

  it('keeps K = 2000 mm/s when S stays at or below 500 mm', () => {
    // ISO 13855 clause 6.2.3: T = 0.2 s, d = 14 mm -> 2000 * 0.2 = 400 mm <= 500 mm.
    const result = minimumDistance({ stoppingPerformance: 0.2, detectionCapability: 14 });
    expect(result.approachSpeed).toBe(2000);
    expect(result.distance).toBeCloseTo(400, 9);
  });

  it('does not go below 500 mm after recomputing with K = 1600 mm/s', () => {
    // T = 0.3 s: 2000 * 0.3 = 600 > 500; 1600 * 0.3 = 480 < 500, so S = 500 mm (ISO 13855 clause 6.2.3).
    expect(minimumDistance({ stoppingPerformance: 0.3, detectionCapability: 14 }).distance).toBe(500);
  });

  it('adds C = 8 (d - 14) mm for a coarser device', () => {
    // d = 30 mm: C = 8 * 16 = 128 mm; T = 0.1 s: 2000 * 0.1 + 128 = 328 mm (ISO 13855 clause 6.2.3).
    const result = minimumDistance({ stoppingPerformance: 0.1, detectionCapability: 30 });
    expect(result.intrusion).toBe(128);
    expect(result.distance).toBeCloseTo(328, 9);
  });
});

describe('ISO/TS 15066:2016 protective separation distance S_p = S_h + S_r + S_s + C + Z_d + Z_r', () => {
  it('gives 1.119 m for the illustrative values', () => {
    // Terms as defined in ISO/TS 15066:2016 clause 5.5.4 and in Marvel and Norcross, Robotics and
    // Computer-Integrated Manufacturing 44 (2017) 144-155; illustrative values:
    // S_h = 1.6 (0.1 + 0.3) = 0.64, S_r = 1.0 * 0.1 = 0.10, S_s = 0.15, C = 0.128, Z_d = 0.1, Z_r = 0.001.
    const result = protectiveSeparationDistance({
      humanSpeed: 1.6,
      robotSpeed: 1.0,
      reactionTime: 0.1,
      stoppingTime: 0.3,
      stoppingDistance: 0.15,
      intrusion: 0.128,
      sensorUncertainty: 0.1,
      robotUncertainty: 0.001,
    });
    expect(result.humanTravel).toBeCloseTo(0.64, 12);
    expect(result.robotReactionTravel).toBeCloseTo(0.1, 12);
    expect(result.total).toBeCloseTo(0.64 + 0.1 + 0.15 + 0.128 + 0.1 + 0.001, 12);
    expect(result.total).toBeCloseTo(1.119, 12);
  });
});
