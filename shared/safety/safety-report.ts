/**
 * The `safety` block of a replay (`replay --json` and `GET /api/replays/:id`): metres, seconds,
 * null where an input is missing. Definitions in docs/safety-analysis.md.
 */
import type { SafetySettings } from './safety-settings';

export type ClearanceBasis = 'reference' | 'replay' | 'onboard';
export type SuggestedClass = 'contact' | 'near_miss' | 'no_hazard';
export const SAFETY_EVENT_KINDS = ['contact', 'protective_stop', 'emergency_stop', 'warning_field'] as const;
export const SUGGESTED_CLASSES: readonly SuggestedClass[] = ['contact', 'near_miss', 'no_hazard'];

export interface ProtectiveSeparationAtEvent {
  edition: string;
  human_speed: number;
  robot_speed: number;
  reaction_time: number;
  stopping_time: number;
  stopping_distance: number;
  intrusion: number;
  sensor_uncertainty: number;
  /** Z_r: 95 % radius of the replay's position belief at the event. */
  robot_uncertainty: number;
  /** S_p */
  total: number;
  /** S_p minus the clearance the robot had; > 0 means the separation was short by this much. */
  shortfall: number | null;
}

export interface SafetyEvent {
  t: number;
  kind: string;
  detail: string;
  /** A suggestion only: the investigator confirms or changes it in the findings. */
  suggested_class: SuggestedClass;
  /** Why, in words, with the numbers. */
  reason: string;
  /** m/s, magnitude */
  speed: number | null;
  /** m, clearance the robot had at the event (reference or replay pose, map and scans). */
  clearance: number | null;
  /** m, clearance it believed (onboard pose vs map). */
  clearance_believed: number | null;
  /** m, smallest clearance it had from 1 s before the event until 1 s after it could have stopped. */
  min_clearance_nearby: number | null;
  stopping_distance: number | null;
  margin: number | null;
  margin_negative_since: number | null;
  /** s: when the two gaps below are taken: margin_negative_since, else the event. */
  gap_at: number;
  /**
   * m: clearance believed (onboard pose, map) minus clearance at the true pose on the same map:
   * the part of the belief-vs-reality gap that is localization error.
   */
  localization_gap: number | null;
  /** m: clearance at the true pose on the map minus the clearance it had: what the map does not show. */
  map_gap: number | null;
  separation: ProtectiveSeparationAtEvent | null;
}

export interface MinimumDistanceResult {
  edition: string;
  device: string;
  detection_capability_mm: number;
  stopping_performance: number;
  approach_speed_mm_s: number;
  intrusion_mm: number;
  distance_mm: number;
}

export interface SafetySeries {
  clearance_reference: (number | null)[];
  clearance_replay: (number | null)[];
  clearance_onboard: (number | null)[];
  contact_probability: (number | null)[];
  stopping_margin: (number | null)[];
  clearance_scan: (number | null)[];
  clearance_map_reference: (number | null)[];
  clearance_map_replay: (number | null)[];
  speed: (number | null)[];
  stopping_distance: (number | null)[];
  clearance_ahead: (number | null)[];
  stopping_margin_believed: (number | null)[];
  position_uncertainty_95: (number | null)[];
}

export interface SafetyReport {
  caution: string;
  settings: SafetySettings & { reaction_time: number; max_decel: number; footprint: unknown };
  /** Clearance the robot had: the reference pose when the bundle has one, else the replay's. */
  min_clearance: { value: number; t: number; to: 'map' | 'scan'; basis: ClearanceBasis } | null;
  events: SafetyEvent[];
  /** Index = replay step; `t` repeats the step times. */
  t: number[];
  series: SafetySeries;
  minimum_distance: MinimumDistanceResult | null;
}
