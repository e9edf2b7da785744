import { reduceMinMax } from './level-of-detail';
import { stepsInDomain, type TimeDomain } from './time-scale';

export interface TrackGeometry {
  /** SVG path `d` of the series: one vertical min-max stroke per pixel column, joined in order. */
  path: string;
  /** Value range shown, for the axis labels; null when nothing finite is in view. */
  extent: [number, number] | null;
}

/**
 * Builds the SVG path of one timeline track over the steps in view, reduced to at most one
 * min/max pair per pixel column so a 6,000-step replay costs no more than the track's width.
 * `times` are the step times (s); `toPx` maps a time to x; y runs from `height` (low) to 0 (high).
 */
export function buildTrackPath(
  times: ArrayLike<number>,
  values: ArrayLike<number | null>,
  domain: TimeDomain,
  widthPx: number,
  height: number,
  toPx: (t: number) => number,
  fixedExtent?: [number, number],
): TrackGeometry {
  const { from, to } = stepsInDomain(times, domain);
  const columns = reduceMinMax(values, from, to, Math.max(1, Math.floor(widthPx)));
  if (columns.length === 0) return { path: '', extent: null };
  let low = fixedExtent?.[0] ?? Number.POSITIVE_INFINITY;
  let high = fixedExtent?.[1] ?? Number.NEGATIVE_INFINITY;
  if (!fixedExtent) {
    for (const c of columns) {
      low = Math.min(low, c.min);
      high = Math.max(high, c.max);
    }
  }
  if (high - low < 1e-9) {
    high += 0.5;
    low -= 0.5;
  }
  const toY = (v: number) => height - ((v - low) / (high - low)) * height;
  let path = '';
  let previousIndex = -2;
  for (let c = 0; c < columns.length; c++) {
    const column = columns[c];
    const x = toPx(times[column.index]).toFixed(1);
    // A column that does not follow the previous one starts a new stroke, so gaps show.
    const isContinuing = c > 0 && column.index - previousIndex <= Math.max(2, (to - from) / widthPx + 1);
    path += `${isContinuing ? 'L' : 'M'}${x},${toY(column.max).toFixed(1)}`;
    if (column.min !== column.max) path += `L${x},${toY(column.min).toFixed(1)}`;
    previousIndex = column.index;
  }
  return { path, extent: [low, high] };
}

/** x positions (px) of flagged steps in view, at most one per pixel, for marker ticks. */
export function markerPositions(
  times: ArrayLike<number>,
  isMarked: (step: number) => boolean,
  domain: TimeDomain,
  toPx: (t: number) => number,
): number[] {
  const { from, to } = stepsInDomain(times, domain);
  const out: number[] = [];
  let lastPx = Number.NEGATIVE_INFINITY;
  for (let k = from; k < to; k++) {
    if (!isMarked(k)) continue;
    const px = Math.round(toPx(times[k]));
    if (px !== lastPx) out.push(px);
    lastPx = px;
  }
  return out;
}
