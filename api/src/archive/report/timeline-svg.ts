import { escapeHtml, formatNumber, SERIES_COLOURS } from './report-colours';

export interface TimelineInput {
  title: string;
  /** Step times, s since the bundle start. */
  t: readonly (number | null)[];
  lines: { label: string; values: readonly (number | null)[]; colour: string }[];
  yLabel: string;
  flags: readonly { start: number; end: number; kind: string }[];
  events: readonly { t: number; kind: string }[];
  /** Upper end of the value axis at most this (values above are drawn at the top). */
  yCap?: number;
}

const WIDTH = 720;
const HEIGHT = 200;
const PAD = { left: 52, right: 12, top: 22, bottom: 30 };

/** Keeps at most about `limit` points per line so a long replay stays a small picture. */
function stride(length: number, limit = 1500): number {
  return Math.max(1, Math.ceil(length / limit));
}

/**
 * A timeline as inline SVG: one polyline per series against time, flag intervals shaded, events
 * as ticks on the time axis. Gaps (null) break the line.
 */
export function renderTimelineSvg(input: TimelineInput): string {
  const times = input.t.filter((v): v is number => v !== null);
  if (times.length === 0) return '';
  const t0 = times[0];
  const t1 = Math.max(times[times.length - 1], t0 + 1e-9);
  const all = input.lines.flatMap((line) =>
    line.values.filter((v): v is number => v !== null && Number.isFinite(v)),
  );
  const yMax = Math.min(input.yCap ?? Number.POSITIVE_INFINITY, Math.max(1e-9, ...all) * 1.05);
  // Values below zero (a negative stopping margin) get room under a zero line.
  const yMin = Math.min(0, ...all) * 1.05;
  const plotW = WIDTH - PAD.left - PAD.right;
  const plotH = HEIGHT - PAD.top - PAD.bottom;
  const x = (t: number) => PAD.left + ((t - t0) / (t1 - t0)) * plotW;
  const y = (v: number) => PAD.top + plotH - ((Math.min(v, yMax) - yMin) / (yMax - yMin)) * plotH;
  const parts: string[] = [];
  for (const flag of input.flags) {
    const x0 = x(Math.max(t0, flag.start));
    const x1 = x(Math.min(t1, flag.end));
    parts.push(
      `<rect x="${x0.toFixed(1)}" y="${PAD.top}" width="${Math.max(1.5, x1 - x0).toFixed(1)}" height="${plotH}" fill="${SERIES_COLOURS.flag}" fill-opacity="0.15"><title>${escapeHtml(flag.kind)} ${formatNumber(flag.start, 1)}–${formatNumber(flag.end, 1)} s</title></rect>`,
    );
  }
  const step = stride(input.t.length);
  for (const line of input.lines) {
    let path = '';
    let isPenDown = false;
    for (let i = 0; i < input.t.length; i += step) {
      const t = input.t[i];
      const v = line.values[i];
      if (t === null || v === null || v === undefined || !Number.isFinite(v)) {
        isPenDown = false;
        continue;
      }
      path += `${isPenDown ? 'L' : 'M'}${x(t).toFixed(1)} ${y(v).toFixed(1)}`;
      isPenDown = true;
    }
    if (path) parts.push(`<path d="${path}" fill="none" stroke="${line.colour}" stroke-width="1.4"/>`);
  }
  for (const event of input.events) {
    if (event.t < t0 || event.t > t1) continue;
    const ex = x(event.t).toFixed(1);
    parts.push(
      `<path d="M${ex} ${PAD.top + plotH}v-10" stroke="${SERIES_COLOURS.event}" stroke-width="2"><title>${escapeHtml(event.kind)} at ${formatNumber(event.t, 1)} s</title></path>`,
    );
  }
  const axis = [
    `<line x1="${PAD.left}" y1="${PAD.top + plotH}" x2="${WIDTH - PAD.right}" y2="${PAD.top + plotH}" stroke="#52606d"/>`,
    `<line x1="${PAD.left}" y1="${PAD.top}" x2="${PAD.left}" y2="${PAD.top + plotH}" stroke="#52606d"/>`,
    `<text x="${PAD.left - 6}" y="${PAD.top + 4}" text-anchor="end" font-size="11">${formatNumber(yMax, 2)}</text>`,
    `<text x="${PAD.left - 6}" y="${PAD.top + plotH}" text-anchor="end" font-size="11">${yMin < 0 ? formatNumber(yMin, 2) : '0'}</text>`,
    ...(yMin < 0
      ? [
          `<line x1="${PAD.left}" y1="${y(0).toFixed(1)}" x2="${WIDTH - PAD.right}" y2="${y(0).toFixed(1)}" stroke="#52606d" stroke-dasharray="3 3"/>`,
          `<text x="${PAD.left - 6}" y="${(y(0) + 4).toFixed(1)}" text-anchor="end" font-size="11">0</text>`,
        ]
      : []),
    `<text x="${PAD.left}" y="${HEIGHT - 8}" font-size="11">${formatNumber(t0, 1)} s</text>`,
    `<text x="${WIDTH - PAD.right}" y="${HEIGHT - 8}" text-anchor="end" font-size="11">${formatNumber(t1, 1)} s</text>`,
    `<text x="${PAD.left}" y="14" font-size="12" font-weight="700">${escapeHtml(input.title)} <tspan font-weight="400" fill="#52606d">(${escapeHtml(input.yLabel)})</tspan></text>`,
  ];
  return `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 ${WIDTH} ${HEIGHT}" width="${WIDTH}" height="${HEIGHT}" role="img" aria-label="${escapeHtml(input.title)}" font-family="Lato, sans-serif">${parts.join('')}${axis.join('')}</svg>`;
}
