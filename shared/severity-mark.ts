import type { TSeverity } from './contracts/cases';
import { SEVERITY_LABELS } from './human-labels';

/**
 * Driftcase's severity mark: the robot's pose (a dot) inside up to three uncertainty contours,
 * tilted like the ellipse of the Driftcase logo. The more severe, the more contours are drawn
 * solid and the stronger the vermillion (the flag colour of design.md, severity by opacity); the
 * contours not reached stay as faint dotted rings, so the scale is always visible. It reads in
 * greyscale and without colour vision by counting solid contours (0, 1, 2, 3 + filled), and it is
 * always drawn beside its word. One geometry feeds the web app and report.html.
 */

export const SEVERITY_LEVEL: Record<TSeverity, 1 | 2 | 3 | 4> = { low: 1, medium: 2, high: 3, critical: 4 };

const VERMILLION = '#D55E00';
const SLATE = '#2E3A4B';
const FAINT = '#8A93A0';

export interface SeverityMarkShape {
  /** The mark is drawn in a 16 × 16 box, centre (8, 8), tilted -25°. */
  contours: { rx: number; ry: number; isSolid: boolean }[];
  colour: string;
  /** Opacity of the solid contours. */
  opacity: number;
  /** Critical only: the innermost contour filled. */
  isFilled: boolean;
  dotColour: string;
}

const CONTOURS = [
  { rx: 3.4, ry: 2.3 },
  { rx: 5.3, ry: 3.7 },
  { rx: 7.2, ry: 5.1 },
];

const OPACITY: Record<TSeverity, number> = { low: 1, medium: 0.7, high: 0.85, critical: 1 };

export function severityMarkShape(severity: TSeverity): SeverityMarkShape {
  const level = SEVERITY_LEVEL[severity];
  return {
    contours: CONTOURS.map((contour, index) => ({ ...contour, isSolid: index < level - 1 })),
    colour: VERMILLION,
    opacity: OPACITY[severity],
    isFilled: level === 4,
    dotColour: level >= 3 ? VERMILLION : SLATE,
  };
}

export const SEVERITY_MARK_TILT = -25;
export const SEVERITY_MARK_FAINT = FAINT;

/** The mark as SVG markup (for report.html), with its word as the accessible name. */
export function renderSeverityMarkSvg(severity: TSeverity, sizePx = 16): string {
  const shape = severityMarkShape(severity);
  const contours = shape.contours
    .map((c, index) => {
      const fill = shape.isFilled && index === 0 ? shape.colour : 'none';
      const fillOpacity = shape.isFilled && index === 0 ? ' fill-opacity="0.35"' : '';
      return c.isSolid || (shape.isFilled && index === 0)
        ? `<ellipse cx="8" cy="8" rx="${c.rx}" ry="${c.ry}" fill="${fill}"${fillOpacity} stroke="${shape.colour}" stroke-opacity="${shape.opacity}" stroke-width="1.4"/>`
        : `<ellipse cx="8" cy="8" rx="${c.rx}" ry="${c.ry}" fill="none" stroke="${FAINT}" stroke-width="0.9" stroke-dasharray="0.6 1.4" stroke-linecap="round"/>`;
    })
    .join('');
  return `<svg class="severity-mark" width="${sizePx}" height="${sizePx}" viewBox="0 0 16 16" role="img" aria-label="Severity: ${SEVERITY_LABELS[severity]}"><g transform="rotate(${SEVERITY_MARK_TILT} 8 8)">${contours}<circle cx="8" cy="8" r="1.5" fill="${shape.dotColour}"/></g></svg>`;
}
