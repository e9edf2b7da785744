/**
 * Wires the safety analysis into a replay: pass `onStepState` to the replay (it reads each step's
 * particle set for the contact probability), then call `finish` with the finished series.
 */
import type { Bundle } from '../bundle/types';
import type { ParticleState } from '../engine/particle-state';
import { analyseSafety } from './analyse-safety';
import { createContactCollector } from './contact-probability';
import { buildObstacleField } from './grid-clearance';
import type { SafetyReport } from './safety-report';
import type { BeliefSeries } from './safety-series';
import type { SafetySettings } from './safety-settings';

export function createSafetyObserver(bundle: Bundle, settings?: Partial<SafetySettings>) {
  const field = bundle.map.grid ? buildObstacleField(bundle.map.grid) : undefined;
  const collector = createContactCollector(field, bundle.manifest.robot.footprint, bundle.odometry.t.length);
  return {
    onStepState: (state: Readonly<ParticleState>, step: number) => collector.observe(state, step),
    finish: (belief: BeliefSeries): SafetyReport =>
      analyseSafety({ bundle, belief, gridContactShare: collector.share, settings }),
  };
}
