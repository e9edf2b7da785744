import type { Footprint } from '@shared/bundle/types';
import type { TReplayStepResponse } from '@shared/contracts/replays';
import { confidenceEllipse } from './covariance-ellipse';
import { cellRgb, heatRgb } from './map-palette';
import { type MapViewport, mapToScreen } from './map-viewport';

export const SERIES_COLOURS = {
  replay: '#0072B2',
  onboard: '#E69F00',
  reference: '#009E73',
  flag: '#D55E00',
  event: '#CC79A7',
  /** Okabe–Ito sky blue: scan endpoints, apart from the particles' blue by lightness. */
  scan: '#56B4E9',
} as const;

/** Pixels (one per cell, row 0 northmost) of the occupancy grid, optionally tinted by a heat map. */
export function gridImage(rows: string[], width: number, heat?: Uint32Array): ImageData {
  const image = new ImageData(width, rows.length);
  let heatMax = 0;
  if (heat) for (let i = 0; i < heat.length; i++) if (heat[i] > heatMax) heatMax = heat[i];
  for (let i = 0; i < rows.length; i++) {
    const row = rows[i];
    for (let j = 0; j < width; j++) {
      const o = (i * width + j) * 4;
      let rgb = cellRgb(row[j], i, j);
      const count = heat && heatMax > 0 ? heat[i * width + j] : 0;
      // Square root keeps a few disagreeing cells visible next to a very hot one.
      if (count > 0) rgb = heatRgb(rgb, heatStrength(count, heatMax));
      image.data[o] = rgb[0];
      image.data[o + 1] = rgb[1];
      image.data[o + 2] = rgb[2];
      image.data[o + 3] = 255;
    }
  }
  return image;
}

/** Heat strength of a cell with `count` disagreeing beams, the hottest having `max`. */
export function heatStrength(count: number, max: number): number {
  return 0.25 + 0.75 * Math.sqrt(count / max);
}

type Context = CanvasRenderingContext2D;
interface Frame {
  ctx: Context;
  view: MapViewport;
  width: number;
  height: number;
}

const at = (f: Frame, x: number, y: number) => mapToScreen(f.view, f.width, f.height, x, y);

/** Particles as small squares, more opaque the heavier; returns how many were drawn. */
export function drawParticles(f: Frame, step: TReplayStepResponse): number {
  let maxWeight = 0;
  for (const w of step.weight) if (w > maxWeight) maxWeight = w;
  const size = Math.max(2, Math.min(5, f.view.pxPerMetre * 0.06));
  f.ctx.fillStyle = SERIES_COLOURS.replay;
  let drawn = 0;
  for (let i = 0; i < step.count; i++) {
    const [px, py] = at(f, step.x[i], step.y[i]);
    if (px < -size || py < -size || px > f.width + size || py > f.height + size) continue;
    f.ctx.globalAlpha = 0.2 + 0.8 * (maxWeight > 0 ? step.weight[i] / maxWeight : 1);
    f.ctx.fillRect(px - size / 2, py - size / 2, size, size);
    drawn++;
  }
  f.ctx.globalAlpha = 1;
  return drawn;
}

/** A pose as a filled circle with a heading tick. */
export function drawPose(f: Frame, x: number, y: number, theta: number, colour: string, radiusPx = 5): void {
  const [px, py] = at(f, x, y);
  f.ctx.fillStyle = colour;
  f.ctx.strokeStyle = '#ffffff';
  f.ctx.lineWidth = 1.5;
  f.ctx.beginPath();
  f.ctx.arc(px, py, radiusPx, 0, 2 * Math.PI);
  f.ctx.fill();
  f.ctx.stroke();
  f.ctx.strokeStyle = colour;
  f.ctx.lineWidth = 2.5;
  f.ctx.beginPath();
  f.ctx.moveTo(px, py);
  f.ctx.lineTo(px + Math.cos(theta) * radiusPx * 3, py - Math.sin(theta) * radiusPx * 3);
  f.ctx.stroke();
}

/** The robot's footprint (circle or rectangle) at a pose, as an outline. */
export function drawFootprint(f: Frame, footprint: Footprint, x: number, y: number, theta: number): void {
  const [px, py] = at(f, x, y);
  const s = f.view.pxPerMetre;
  f.ctx.strokeStyle = SERIES_COLOURS.replay;
  f.ctx.lineWidth = 1.5;
  f.ctx.setLineDash([4, 3]);
  f.ctx.beginPath();
  if (footprint.shape === 'circle') {
    f.ctx.arc(px, py, footprint.radius * s, 0, 2 * Math.PI);
  } else {
    f.ctx.save();
    f.ctx.translate(px, py);
    f.ctx.rotate(-theta);
    f.ctx.rect(
      (-footprint.length / 2) * s,
      (-footprint.width / 2) * s,
      footprint.length * s,
      footprint.width * s,
    );
    f.ctx.restore();
  }
  f.ctx.stroke();
  f.ctx.setLineDash([]);
}

/** The 95 % covariance ellipse of the weighted mean position. */
export function drawCovarianceEllipse(f: Frame, step: TReplayStepResponse): void {
  const ellipse = confidenceEllipse(step.covariance.xx, step.covariance.xy, step.covariance.yy);
  if (!ellipse) return;
  const [px, py] = at(f, step.mean.x, step.mean.y);
  f.ctx.strokeStyle = SERIES_COLOURS.replay;
  f.ctx.lineWidth = 2;
  f.ctx.beginPath();
  f.ctx.ellipse(
    px,
    py,
    Math.max(1, ellipse.major * f.view.pxPerMetre),
    Math.max(1, ellipse.minor * f.view.pxPerMetre),
    -ellipse.angle,
    0,
    2 * Math.PI,
  );
  f.ctx.stroke();
}

/** Scan endpoints placed at the mean pose, as small dots: on a wall they agree with the map. */
export function drawScanEndpoints(f: Frame, endpoints: number[]): void {
  f.ctx.fillStyle = SERIES_COLOURS.scan;
  for (let i = 0; i + 1 < endpoints.length; i += 2) {
    const [px, py] = at(f, endpoints[i], endpoints[i + 1]);
    f.ctx.fillRect(px - 1.5, py - 1.5, 3, 3);
  }
}

/** Landmarks as outlined triangles with their class initial. */
export function drawLandmarks(f: Frame, landmarks: { x: number; y: number; class: string }[]): void {
  f.ctx.strokeStyle = '#1b2430';
  f.ctx.fillStyle = '#ffffff';
  f.ctx.lineWidth = 1.2;
  for (const landmark of landmarks) {
    const [px, py] = at(f, landmark.x, landmark.y);
    f.ctx.beginPath();
    f.ctx.moveTo(px, py - 6);
    f.ctx.lineTo(px + 5, py + 4);
    f.ctx.lineTo(px - 5, py + 4);
    f.ctx.closePath();
    f.ctx.fill();
    f.ctx.stroke();
  }
}
