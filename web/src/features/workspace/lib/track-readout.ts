import type { TrackSpec } from '../hooks/use-track-specs';
import { nearestStep } from './time-scale';

export interface TrackReadout {
  id: string;
  label: string;
  unit: string;
  lines: { name: string; colour: string; dashed?: boolean; value: number | null; time: number | null }[];
}

/**
 * Every track's value at time `t`: each line's sample nearest `t` (lines keep their own times,
 * e.g. odometry speed at its rate), null where the line has no value there or no samples at all.
 */
export function readTracksAt(specs: readonly TrackSpec[], t: number): TrackReadout[] {
  return specs.map((spec) => ({
    id: spec.id,
    label: spec.label,
    unit: spec.unit,
    lines: spec.lines.map((line) => {
      const k = nearestStep(line.times, t);
      const value = k >= 0 ? line.values[k] : null;
      return {
        name: line.name,
        colour: line.colour,
        dashed: line.dashed,
        value: value === null || value === undefined || !Number.isFinite(value) ? null : value,
        time: k >= 0 ? line.times[k] : null,
      };
    }),
  }));
}

/** A value as the readout shows it: fewer decimals as the magnitude grows, enough to read a track by. */
export function formatReadoutValue(value: number | null): string {
  if (value === null) return 'no value';
  const magnitude = Math.abs(value);
  if (magnitude >= 100) return value.toFixed(0);
  if (magnitude >= 10) return value.toFixed(1);
  if (magnitude >= 1) return value.toFixed(2);
  return value.toFixed(3);
}
