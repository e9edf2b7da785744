import { range } from 'd3';
import { describe, expect, it } from 'vitest';
import { createTimeScale } from '../../../../web/src/features/workspace/lib/time-scale';
import { buildTrackPath, markerPositions } from '../../../../web/src/features/workspace/lib/track-path';

describe('timeline track path', () => {
  const times = range(0, 6000).map((k) => k * 0.1);
  const domain = { start: 0, end: 599.9 };
  const scale = createTimeScale(domain, 0, 800);

  it('draws a 6,000-step series with at most two points per pixel column', () => {
    const values = times.map((t) => Math.sin(t));
    const { path, extent } = buildTrackPath(times, values, domain, 800, 40, scale.toPx);
    const points = path.match(/[ML]/g)?.length ?? 0;
    expect(points).toBeLessThanOrEqual(2 * 800);
    expect(points).toBeGreaterThan(800);
    expect(extent![0]).toBeCloseTo(-1, 3);
    expect(extent![1]).toBeCloseTo(1, 3);
  });

  it('starts a new stroke after a gap of missing values', () => {
    const values = times.map((t) => (t > 200 && t < 300 ? null : 1 + (t % 3)));
    const { path } = buildTrackPath(times, values, domain, 800, 40, scale.toPx);
    expect(path.match(/M/g)?.length).toBe(2);
  });

  it('puts the extremes at the top and bottom of the track', () => {
    const values = [0, 10, 5];
    const { path } = buildTrackPath([0, 1, 2], values, { start: 0, end: 2 }, 100, 40, (t) => t * 50);
    expect(path).toBe('M0.0,40.0L50.0,0.0L100.0,20.0');
  });

  it('leaves one marker per pixel however many steps fall there', () => {
    const positions = markerPositions(times, (k) => k % 2 === 0, domain, scale.toPx);
    expect(new Set(positions).size).toBe(positions.length);
    expect(positions.length).toBeLessThanOrEqual(801);
  });
});
