import type { SafetyReport } from '@shared/safety/safety-report';
import { useMemo } from 'react';
import type { TrackSpec } from './use-track-specs';

/** Beyond this (m) clearance and margin are drawn flat: the tracks are about the close calls. */
const CAP = 2;
const capped = (values: (number | null)[]) => values.map((v) => (v === null ? null : Math.min(CAP, v)));

/**
 * Timeline tracks of the separation and stopping analysis: the clearance the robot had and the one
 * it believed, the contact probability under the belief, and the stopping margin.
 */
export function useSafetyTrackSpecs(safety: SafetyReport | null | undefined): TrackSpec[] {
  return useMemo(() => {
    if (!safety) return [];
    const t = safety.t;
    const s = safety.series;
    const hasReference = s.clearance_reference.some((v) => v !== null);
    return [
      {
        id: 'safety-clearance',
        label: 'Clearance had / believed',
        unit: `m, ${hasReference ? 'reference' : 'replay'} pose vs map and scans / onboard pose vs map`,
        lines: [
          {
            times: t,
            values: capped(hasReference ? s.clearance_reference : s.clearance_replay),
            name: 'had',
            colour: '#009E73',
          },
          {
            times: t,
            values: capped(s.clearance_onboard),
            name: 'believed',
            colour: '#E69F00',
            dashed: true,
          },
        ],
        rule: { value: 0, label: 'footprint touches' },
      },
      {
        id: 'safety-contact',
        label: 'Contact probability',
        unit: 'share of belief',
        lines: [{ times: t, values: s.contact_probability, name: 'contact probability', colour: '#0072B2' }],
      },
      {
        id: 'safety-margin',
        label: 'Stopping margin',
        unit: 'm, clearance ahead minus stopping distance',
        lines: [
          { times: t, values: capped(s.stopping_margin), name: 'had', colour: '#D55E00' },
          {
            times: t,
            values: capped(s.stopping_margin_believed),
            name: 'believed',
            colour: '#E69F00',
            dashed: true,
          },
        ],
        rule: { value: 0, label: 'below: could not have stopped in time' },
      },
    ];
  }, [safety]);
}
