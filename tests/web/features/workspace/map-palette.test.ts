import type { TBundleMap } from '@shared/contracts/bundle-views';
import { cellRgb, hexToRgb, MAP_PALETTE } from '@web/features/workspace/lib/map-palette';
import { momentDisagreement } from '@web/features/workspace/lib/moment-disagreement';
import { describe, expect, it } from 'vitest';

// Relative luminance and contrast ratio as defined by WCAG 2.1, section 1.4.3 / "relative
// luminance" (W3C Recommendation): lightness differences survive every kind of colour vision.
function luminance(hex: string): number {
  const [r, g, b] = hexToRgb(hex).map((v) => {
    const c = v / 255;
    return c <= 0.03928 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
  });
  return 0.2126 * r + 0.7152 * g + 0.0722 * b;
}
const contrast = (a: string, b: string) => {
  const [hi, lo] = [luminance(a), luminance(b)].sort((x, y) => y - x);
  return (hi + 0.05) / (lo + 0.05);
};

describe('Driftcase map palette', () => {
  it('is not the black / white / grey of common visualisers', () => {
    expect(MAP_PALETTE.occupied).not.toMatch(/^#(000000|222222)$/i);
    expect(MAP_PALETTE.free.toUpperCase()).not.toBe('#FFFFFF');
    expect(hexToRgb(MAP_PALETTE.free)).toEqual([0xf7, 0xf4, 0xec]); // design.md: warm paper
  });

  it('tells occupied from free and unknown by lightness (WCAG contrast ≥ 3:1 for graphics, 1.4.11)', () => {
    expect(contrast(MAP_PALETTE.occupied, MAP_PALETTE.free)).toBeGreaterThan(3);
    expect(contrast(MAP_PALETTE.occupied, MAP_PALETTE.unknown)).toBeGreaterThan(3);
  });

  it('hatches unknown cells on every 4th diagonal', () => {
    expect(cellRgb('?', 0, 0)).toEqual(hexToRgb(MAP_PALETTE.unknownHatch));
    expect(cellRgb('?', 0, 1)).toEqual(hexToRgb(MAP_PALETTE.unknown));
    expect(cellRgb('?', 1, 3)).toEqual(hexToRgb(MAP_PALETTE.unknownHatch));
  });
});

describe('map disagreement at one step', () => {
  // A 3 x 2 grid of 1 m cells from (0, 0): row 0 is the north row (y in [1, 2)).
  const map: TBundleMap = {
    resolution: 1,
    origin: [0, 0],
    width: 3,
    height: 2,
    rows: ['.#.', '..#'],
    landmarks: [],
    footprint: { shape: 'circle', radius: 0.3 },
    scanMount: null,
  };

  it('counts beam ends on free cells, by hand: (0.5, 1.5) north-west free, (1.5, 1.5) occupied, (0.2, 0.2) south-west free twice', () => {
    const ends = [9, 9, 0.5, 1.5, 9, 9, 1.5, 1.5, 9, 9, 0.2, 0.2, 9, 9, 0.7, 0.9, 9, 9, 5, 5];
    const heat = momentDisagreement(map, ends);
    expect(Array.from(heat)).toEqual([1, 0, 0, 2, 0, 0]);
  });
});
