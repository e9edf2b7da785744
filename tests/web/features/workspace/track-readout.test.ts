import { describe, expect, it } from 'vitest';
import type { TrackSpec } from '../../../../web/src/features/workspace/hooks/use-track-specs';
import { formatReadoutValue, readTracksAt } from '../../../../web/src/features/workspace/lib/track-readout';

// Hand-written tracks: the expected readouts are read off the arrays below by eye.
const SPECS: TrackSpec[] = [
  {
    id: 'speed',
    label: 'Speed',
    unit: 'm/s',
    lines: [
      { times: [0, 0.05, 0.1, 0.15], values: [0.5, 0.52, 0.54, 0.56], name: 'odometry', colour: '#111' },
      { times: [0, 0.2], values: [0.6, 0.4], name: 'commanded', colour: '#222', dashed: true },
    ],
  },
  {
    id: 'error',
    label: 'Position error',
    unit: 'm',
    lines: [
      { times: [0, 0.1, 0.2], values: [0.01, null, Number.NaN], name: 'replay vs reference', colour: '#333' },
    ],
  },
  {
    id: 'empty',
    label: 'Clearance',
    unit: 'm',
    lines: [{ times: [], values: [], name: 'map', colour: '#444' }],
  },
];

describe('the timeline readout at the pointer', () => {
  it('reads each line at its own nearest sample, at its own rate', () => {
    const [speed] = readTracksAt(SPECS, 0.12);
    expect(speed.lines.map((line) => [line.name, line.value, line.time])).toEqual([
      ['odometry', 0.54, 0.1],
      ['commanded', 0.4, 0.2],
    ]);
  });

  it('says "no value" for gaps, non-finite values and lines without samples', () => {
    const readout = readTracksAt(SPECS, 0.1);
    expect(readout[1].lines[0].value).toBeNull();
    expect(readTracksAt(SPECS, 0.2)[1].lines[0].value).toBeNull();
    expect(readout[2].lines[0]).toMatchObject({ value: null, time: null });
    expect(formatReadoutValue(null)).toBe('no value');
  });

  it('shows fewer decimals as the magnitude grows', () => {
    expect([1234.5, 42.345, 1.23456, 0.012345, -0.5].map(formatReadoutValue)).toEqual([
      '1235',
      '42.3',
      '1.23',
      '0.012',
      '-0.500',
    ]);
  });
});
