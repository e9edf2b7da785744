import type { TBundleTracks } from '@shared/contracts/bundle-views';
import type { TReplaySeriesResponse } from '@shared/contracts/replays';
import { useMemo } from 'react';

export interface TrackLine {
  times: ArrayLike<number>;
  values: ArrayLike<number | null>;
  /** What the line shows, in the legend and the pointer readout (e.g. "onboard vs reference"). */
  name: string;
  colour: string;
  dashed?: boolean;
}
export interface TrackSpec {
  id: string;
  label: string;
  unit: string;
  lines: TrackLine[];
  /** Horizontal reference line (e.g. the resampling threshold), value in track units. */
  rule?: { value: number; label: string };
}

/** The timeline's stacked tracks, in order, from the replay series and the bundle's tracks. */
export function useTrackSpecs(
  series: TReplaySeriesResponse,
  tracks: TBundleTracks | undefined,
  clearance?: (number | null)[],
) {
  return useMemo<TrackSpec[]>(() => {
    const c = series.columns;
    const t = c.t as number[];
    const particles = c.particles?.[0] ?? 0;
    const specs: TrackSpec[] = [
      {
        id: 'ess',
        label: 'Effective sample size',
        unit: 'particles',
        lines: [{ times: t, values: c.ess, name: 'effective sample size', colour: '#0072B2' }],
        rule: particles
          ? { value: series.resamplingThreshold * particles, label: 'resampling threshold' }
          : undefined,
      },
      {
        id: 'loglik',
        label: 'Log-likelihood',
        unit: 'nats',
        lines: [{ times: t, values: c.log_likelihood, name: 'per measurement', colour: '#0072B2' }],
      },
      {
        id: 'error',
        label: 'Position error',
        unit: 'm',
        lines: [
          { times: t, values: c.error_reference, name: 'replay vs reference', colour: '#009E73' },
          {
            times: t,
            values: c.error_onboard,
            name: 'onboard vs reference',
            colour: '#E69F00',
            dashed: true,
          },
        ],
      },
    ];
    if (tracks) {
      const speed: TrackLine[] = [
        { times: tracks.speed.t, values: tracks.speed.speed, name: 'odometry', colour: '#5a6472' },
      ];
      if (tracks.commands)
        speed.push({
          times: tracks.commands.t,
          values: tracks.commands.v,
          name: 'commanded',
          colour: '#8a93a0',
          dashed: true,
        });
      specs.push({ id: 'speed', label: 'Speed', unit: 'm/s', lines: speed });
    }
    if (clearance) {
      specs.push({
        id: 'clearance',
        label: 'Clearance',
        unit: 'm, footprint to map',
        lines: [{ times: t, values: clearance, name: 'replay pose to map', colour: '#0072B2' }],
        rule: { value: 0, label: 'footprint touches' },
      });
    }
    return specs;
  }, [series, tracks, clearance]);
}
