/**
 * Contact probability under the belief: the share of particle weight whose footprint touches or
 * overlaps an occupied map cell. A scan return within the margin of the footprint counts for the
 * whole belief: returns are measured from the robot itself, so every particle carries them along.
 */
import type { Footprint } from '../bundle/types';
import { exp } from '../engine/numerics';
import type { ParticleState } from '../engine/particle-state';
import { footprintHitsGrid, type ObstacleField } from './grid-clearance';

/** Weighted share (0..1) of the particle set whose footprint touches an occupied cell. */
export function gridContactShare(field: ObstacleField, footprint: Footprint, state: ParticleState): number {
  let hit = 0;
  let total = 0;
  for (let p = 0; p < state.count; p++) {
    const w = exp(state.logWeight[p]);
    total += w;
    if (footprintHitsGrid(field, footprint, state.x[p], state.y[p], state.theta[p])) hit += w;
  }
  return total > 0 ? hit / total : 0;
}

/**
 * Collects the grid contact share after every replay step (pass `observe` as the replay's
 * `onStepState`); the scan part is added by the safety analysis, which knows the scans.
 */
export function createContactCollector(
  field: ObstacleField | undefined,
  footprint: Footprint,
  steps: number,
) {
  const share = new Float64Array(steps).fill(Number.NaN);
  return {
    share,
    observe(state: ParticleState, step: number): void {
      if (field && step >= 0 && step < steps) share[step] = gridContactShare(field, footprint, state);
    },
  };
}
