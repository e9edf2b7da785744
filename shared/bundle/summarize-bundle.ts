import type { Bundle } from './types';

/** Sensors a bundle can carry; the other tables are records of commands, beliefs and events. */
export type SensorName = 'odometry' | 'laser' | 'landmark_detector';

/** Overview of a valid bundle, as shown on the bundle page and by `cli check`. */
export interface BundleSummary {
  robotId: string;
  site: string;
  /** RFC 3339 instant that every `t` counts from. */
  startTime: string;
  /** Rows per table, keyed by file stem (`odometry`, `scans`, ...); absent tables are left out. */
  rows: Record<string, number>;
  /** First and last `t` over all time-stamped tables, s since startTime; null when all are empty. */
  timeSpan: { start: number; end: number } | null;
  /** s */
  durationSeconds: number;
  sensors: SensorName[];
  /** Events per kind, in order of first appearance. */
  eventCounts: Record<string, number>;
}

/** Computes row counts, time span, sensors present and event counts of a parsed bundle. */
export function summarizeBundle(bundle: Bundle): BundleSummary {
  const timeColumns: Record<string, Float64Array | undefined> = {
    odometry: bundle.odometry.t,
    scans: bundle.scans?.t,
    detections: bundle.detections?.t,
    onboard_pose: bundle.onboard?.t,
    events: bundle.events?.t,
    commands: bundle.commands?.t,
    reference_pose: bundle.reference?.t,
  };
  const rows: Record<string, number> = {};
  let start = Number.POSITIVE_INFINITY;
  let end = Number.NEGATIVE_INFINITY;
  for (const [name, t] of Object.entries(timeColumns)) {
    if (!t) continue;
    rows[name] = t.length;
    if (t.length === 0) continue;
    // Every table is sorted by t, so its first and last rows bound it.
    start = Math.min(start, t[0]);
    end = Math.max(end, t[t.length - 1]);
  }
  const sensors: SensorName[] = ['odometry'];
  if (bundle.scans) sensors.push('laser');
  if (bundle.detections) sensors.push('landmark_detector');
  const eventCounts: Record<string, number> = {};
  for (const kind of bundle.events?.kind ?? []) eventCounts[kind] = (eventCounts[kind] ?? 0) + 1;
  const timeSpan = Number.isFinite(start) ? { start, end } : null;
  return {
    robotId: bundle.manifest.robot.id,
    site: bundle.manifest.site,
    startTime: bundle.manifest.start_time,
    rows,
    timeSpan,
    durationSeconds: timeSpan ? timeSpan.end - timeSpan.start : 0,
    sensors,
    eventCounts,
  };
}
