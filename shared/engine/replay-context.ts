/**
 * Everything precomputed once per bundle + settings: likelihood field, beam geometry, landmark
 * model, free space and the step timeline. Read-only during the replay, so it can be shared by
 * worker threads (each rebuilds it from the same inputs).
 */
import type { Bundle } from '../bundle/types';
import { buildFreeSpace, type FreeSpace } from './free-space';
import { buildLandmarkModel, type LandmarkModel } from './landmark-model';
import {
  type BeamGeometry,
  buildBeamGeometry,
  buildLikelihoodField,
  type LikelihoodField,
} from './likelihood-field';
import { particleCapacity, type ReplaySettings } from './settings';
import { buildStepTimeline, type StepTimeline } from './step-timeline';

export interface ReplayContext {
  bundle: Bundle;
  settings: ReplaySettings;
  capacity: number;
  timeline: StepTimeline;
  freeSpace: FreeSpace;
  /** Present when the bundle has scans, a grid, a scan config and a scan model. */
  field?: LikelihoodField;
  beams?: BeamGeometry;
  /** Present when the bundle has detections, landmarks and a detector config. */
  landmarks?: LandmarkModel;
}

export function buildReplayContext(bundle: Bundle, settings: ReplaySettings): ReplayContext {
  const { manifest, map } = bundle;
  const usesScans = Boolean(bundle.scans && map.grid && manifest.scan && settings.scan_model);
  const usesDetections = Boolean(bundle.detections && manifest.detector && map.landmarks.length > 0);
  return {
    bundle,
    settings,
    capacity: particleCapacity(settings),
    timeline: buildStepTimeline(bundle),
    freeSpace: buildFreeSpace(map),
    field: usesScans
      ? buildLikelihoodField(map.grid!, settings.scan_model!, manifest.scan!.range_max)
      : undefined,
    beams: usesScans ? buildBeamGeometry(manifest.scan!, settings.scan_model!.beams_used) : undefined,
    landmarks: usesDetections ? buildLandmarkModel(map.landmarks, manifest.detector!) : undefined,
  };
}
