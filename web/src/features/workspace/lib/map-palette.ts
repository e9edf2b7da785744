/**
 * Driftcase's own map palette (docs: ../shared/notes/design.md), not the black / white / grey
 * of common robotics visualisers: occupied cells deep slate, free cells warm paper, unknown cells
 * a fine diagonal hatch, map disagreement a vermillion heat scale. Lightness alone separates
 * occupied, free and unknown, so the map reads for every kind of colour vision (and in greyscale
 * print); the heat scale is the Okabe–Ito vermillion (Okabe & Ito 2008) by strength.
 */
export type Rgb = readonly [number, number, number];

export const MAP_PALETTE = {
  occupied: '#2E3A4B',
  free: '#F7F4EC',
  unknown: '#E4E1D8',
  /** The hatch lines drawn over unknown cells. */
  unknownHatch: '#C9C4B6',
  heat: '#D55E00',
  /** Around the grid, so the map's edge is visible. */
  surround: '#ECEAE3',
} as const;

export function hexToRgb(hex: string): Rgb {
  const n = Number.parseInt(hex.slice(1), 16);
  return [(n >> 16) & 255, (n >> 8) & 255, n & 255];
}

const OCCUPIED = hexToRgb(MAP_PALETTE.occupied);
const FREE = hexToRgb(MAP_PALETTE.free);
const UNKNOWN = hexToRgb(MAP_PALETTE.unknown);
const HATCH = hexToRgb(MAP_PALETTE.unknownHatch);
export const HEAT_RGB = hexToRgb(MAP_PALETTE.heat);

/** Every 4th anti-diagonal of unknown cells is a hatch line (one pixel per cell). */
const HATCH_PERIOD = 4;

/** The colour of one map.json cell character at grid row `i`, column `j`. */
export function cellRgb(cell: string | undefined, i: number, j: number): Rgb {
  if (cell === '#') return OCCUPIED;
  if (cell === '.') return FREE;
  return (i + j) % HATCH_PERIOD === 0 ? HATCH : UNKNOWN;
}

/** Blends `base` towards vermillion by `strength` in [0, 1]. */
export function heatRgb(base: Rgb, strength: number): Rgb {
  const s = Math.max(0, Math.min(1, strength));
  return [
    Math.round(base[0] * (1 - s) + HEAT_RGB[0] * s),
    Math.round(base[1] * (1 - s) + HEAT_RGB[1] * s),
    Math.round(base[2] * (1 - s) + HEAT_RGB[2] * s),
  ];
}
