import { CELL_OCCUPIED, CELL_UNKNOWN, type OccupancyGrid } from '../../../../shared/bundle/types';
import { encodeGreyscalePng } from './png-encoder';
import { escapeHtml, SERIES_COLOURS } from './report-colours';

export interface MapPose {
  x: number;
  y: number;
  theta: number;
}

export interface MapPictureInput {
  grid: OccupancyGrid;
  caption: string;
  /** Mean trajectory of the replay up to the moment, map frame, m. */
  trajectory: readonly { x: number; y: number }[];
  replay: MapPose | null;
  reference: MapPose | null;
  onboard: MapPose | null;
}

/** Longest picture side in pixels: enough to read aisles, small enough to inline. */
const MAX_SIDE = 360;

/** Downsampled grid as a PNG data URL: occupied dark, unknown light grey, free white. */
function gridDataUrl(grid: OccupancyGrid, factor: number): { url: string; width: number; height: number } {
  const width = Math.ceil(grid.width / factor);
  const height = Math.ceil(grid.height / factor);
  const pixels = new Uint8Array(width * height).fill(255);
  for (let i = 0; i < grid.height; i++) {
    for (let j = 0; j < grid.width; j++) {
      const cell = grid.cells[i * grid.width + j];
      const p = Math.floor(i / factor) * width + Math.floor(j / factor);
      // The darkest cell of a block wins, so thin walls survive downsampling.
      const shade = cell === CELL_OCCUPIED ? 40 : cell === CELL_UNKNOWN ? 215 : 255;
      if (shade < pixels[p]) pixels[p] = shade;
    }
  }
  return {
    url: `data:image/png;base64,${encodeGreyscalePng(width, height, pixels).toString('base64')}`,
    width,
    height,
  };
}

function poseMarker(
  pose: MapPose,
  colour: string,
  label: string,
  toPixel: (x: number, y: number) => [number, number],
) {
  const [px, py] = toPixel(pose.x, pose.y);
  const hx = px + 12 * Math.cos(pose.theta);
  const hy = py - 12 * Math.sin(pose.theta);
  return `<g><title>${escapeHtml(label)}</title><circle cx="${px.toFixed(1)}" cy="${py.toFixed(1)}" r="4.5" fill="${colour}" stroke="#fff" stroke-width="1"/><line x1="${px.toFixed(1)}" y1="${py.toFixed(1)}" x2="${hx.toFixed(1)}" y2="${hy.toFixed(1)}" stroke="${colour}" stroke-width="2.2"/></g>`;
}

/**
 * A map picture at one moment as inline SVG: the occupancy grid, the replay's mean trajectory so
 * far, and the replay, reference and onboard poses with their headings (map frame, north up).
 */
export function renderMapPictureSvg(input: MapPictureInput): string {
  const { grid } = input;
  const factor = Math.max(1, Math.ceil(Math.max(grid.width, grid.height) / MAX_SIDE));
  const image = gridDataUrl(grid, factor);
  const scale = 1 / (grid.resolution * factor);
  const toPixel = (x: number, y: number): [number, number] => [
    (x - grid.origin[0]) * scale,
    image.height - (y - grid.origin[1]) * scale,
  ];
  const trail = input.trajectory
    .map((p, i) => {
      const [px, py] = toPixel(p.x, p.y);
      return `${i === 0 ? 'M' : 'L'}${px.toFixed(1)} ${py.toFixed(1)}`;
    })
    .join('');
  const markers = [
    input.reference && poseMarker(input.reference, SERIES_COLOURS.reference, 'reference pose', toPixel),
    input.onboard && poseMarker(input.onboard, SERIES_COLOURS.onboard, 'onboard pose', toPixel),
    input.replay && poseMarker(input.replay, SERIES_COLOURS.replay, 'replay mean pose', toPixel),
  ].filter(Boolean);
  return `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 ${image.width} ${image.height}" width="${image.width}" height="${image.height}" role="img" aria-label="${escapeHtml(input.caption)}"><image href="${image.url}" width="${image.width}" height="${image.height}" style="image-rendering:pixelated"/>${trail ? `<path d="${trail}" fill="none" stroke="${SERIES_COLOURS.replay}" stroke-width="1.5" stroke-opacity="0.8"/>` : ''}${markers.join('')}</svg>`;
}
