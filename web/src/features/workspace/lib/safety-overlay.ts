import type { Footprint } from '@shared/bundle/types';
import type { SafetyReport } from '@shared/safety/safety-report';
import { type Frame, SERIES_COLOURS } from './map-drawing';
import { mapToScreen } from './map-viewport';

export interface SafetyOverlayInput {
  safety: SafetyReport;
  step: number;
  footprint: Footprint;
  /** The pose the robot really had at the step (reference, else replay mean), map frame. */
  pose: { x: number; y: number; theta: number };
}

function outline(f: Frame, footprint: Footprint, inflate: number): void {
  const s = f.view.pxPerMetre;
  if (footprint.shape === 'circle') f.ctx.arc(0, 0, (footprint.radius + inflate) * s, 0, 2 * Math.PI);
  else
    f.ctx.roundRect(
      (-footprint.length / 2 - inflate) * s,
      (-footprint.width / 2 - inflate) * s,
      (footprint.length + 2 * inflate) * s,
      (footprint.width + 2 * inflate) * s,
      inflate * s,
    );
}

/**
 * At the current step: the footprint where the robot really was, the stopping distance drawn ahead
 * of it along the direction of travel (vermillion when the margin is negative: it could not have
 * stopped in time), and the clearance as a dashed line around the footprint at that distance.
 */
export function drawSafetyOverlay(f: Frame, { safety, step, footprint, pose }: SafetyOverlayInput): void {
  const s = f.view.pxPerMetre;
  const [px, py] = mapToScreen(f.view, f.width, f.height, pose.x, pose.y);
  const speed = safety.series.speed[step] ?? 0;
  const stopping = safety.series.stopping_distance[step] ?? 0;
  const margin = safety.series.stopping_margin[step];
  const clearance = safety.series.clearance_reference[step] ?? safety.series.clearance_replay[step];
  const ctx = f.ctx;
  ctx.save();
  ctx.translate(px, py);
  // Screen y grows downward, so a map heading turns the other way.
  ctx.rotate(-pose.theta);
  const half = footprint.shape === 'circle' ? footprint.radius : footprint.width / 2;
  const front = footprint.shape === 'circle' ? footprint.radius : footprint.length / 2;
  const direction = speed < -0.01 ? -1 : 1;
  if (stopping > 0) {
    const isShort = margin !== null && margin < 0;
    ctx.fillStyle = isShort ? SERIES_COLOURS.flag : SERIES_COLOURS.reference;
    ctx.globalAlpha = 0.25;
    const start = direction * front * s;
    ctx.fillRect(Math.min(start, start + direction * stopping * s), -half * s, stopping * s, 2 * half * s);
    ctx.globalAlpha = 1;
    ctx.strokeStyle = ctx.fillStyle;
    ctx.lineWidth = 2;
    ctx.beginPath();
    ctx.moveTo(start + direction * stopping * s, -half * s);
    ctx.lineTo(start + direction * stopping * s, half * s);
    ctx.stroke();
  }
  ctx.strokeStyle = SERIES_COLOURS.reference;
  ctx.lineWidth = 2;
  ctx.beginPath();
  outline(f, footprint, 0);
  ctx.stroke();
  if (clearance !== null && clearance !== undefined && clearance > 0) {
    ctx.setLineDash([2, 3]);
    ctx.lineWidth = 1.5;
    ctx.beginPath();
    outline(f, footprint, clearance);
    ctx.stroke();
    ctx.setLineDash([]);
  }
  ctx.restore();
}
