/**
 * Sensor-frame persistence: per used beam index, the share of scans in an interval whose return
 * was missing or implausibly short, against the same beam's share just before. A sensor fault
 * shows on the same beams whatever the pose; the world moves through the beams as the robot moves.
 */
import type { ReplayContext } from '../replay-context';

/** Returns shorter than this (m) count as implausibly short (frost, fog, dirt on the window). */
export const SHORT_RANGE = 0.8;
/** A beam is suspect when its bad share in the interval is at least this ... */
export const SUSPECT_SHARE = 0.5;
/** ... and at least this much above its share before the interval. */
export const SUSPECT_RISE = 0.3;
/** Seconds before the interval that give each beam's usual share. */
export const BEAM_REFERENCE_SECONDS = 10;

export interface BeamPersistence {
  /** Used beam indices (into the scan) that went bad, by missing or short returns. */
  suspect: number[];
  /** Of them, those whose returns were mostly short rather than missing. */
  shortSuspect: number[];
  usedBeams: number;
  /** Share of returns in the interval that were missing, and that were short (of all used beams). */
  missingShare: number;
  shortShare: number;
  /** The same shares before the interval. */
  missingBefore: number;
  shortBefore: number;
}

function shares(context: ReplayContext, start: number, end: number) {
  const scans = context.bundle.scans!;
  const scan = context.bundle.manifest.scan!;
  const indices = context.beams!.indices;
  const missing = new Float64Array(indices.length);
  const short = new Float64Array(indices.length);
  let rows = 0;
  for (let row = 0; row < scans.count; row++) {
    if (scans.t[row] < start || scans.t[row] > end) continue;
    rows++;
    for (let b = 0; b < indices.length; b++) {
      const range = scans.ranges[row * scans.beams + indices[b]];
      if (!(range >= scan.range_min && range < scan.range_max)) missing[b]++;
      else if (range < SHORT_RANGE) short[b]++;
    }
  }
  if (rows > 0)
    for (let b = 0; b < indices.length; b++) {
      missing[b] /= rows;
      short[b] /= rows;
    }
  return { missing, short, rows };
}

const mean = (values: Float64Array) =>
  values.length ? values.reduce((a, b) => a + b, 0) / values.length : 0;

/** Beam persistence over [start, end] against the BEAM_REFERENCE_SECONDS before; undefined without scans. */
export function measureBeamPersistence(
  context: ReplayContext,
  start: number,
  end: number,
): BeamPersistence | undefined {
  if (!context.beams || !context.bundle.scans || !context.bundle.manifest.scan) return undefined;
  const during = shares(context, start, end);
  const before = shares(context, start - BEAM_REFERENCE_SECONDS, start - 1e-9);
  const indices = context.beams.indices;
  const suspect: number[] = [];
  const shortSuspect: number[] = [];
  for (let b = 0; b < indices.length; b++) {
    const bad = during.missing[b] + during.short[b];
    const usual = before.rows > 0 ? before.missing[b] + before.short[b] : 0;
    if (bad < SUSPECT_SHARE || bad - usual < SUSPECT_RISE) continue;
    suspect.push(indices[b]);
    if (during.short[b] > during.missing[b]) shortSuspect.push(indices[b]);
  }
  return {
    suspect,
    shortSuspect,
    usedBeams: indices.length,
    missingShare: mean(during.missing),
    shortShare: mean(during.short),
    missingBefore: mean(before.missing),
    shortBefore: mean(before.short),
  };
}
