import { SERIES_COLOURS } from './map-drawing';
import { captionedSvg, escapeXml } from './picture-svg';

/** Height of the key printed under the map, px. */
const KEY_BAND = 22;

/** The map's colours named on the picture itself, so it reads without the app's legend beside it. */
const KEY = [
  { colour: SERIES_COLOURS.replay, words: 'replay belief' },
  { colour: SERIES_COLOURS.onboard, words: 'onboard estimate' },
  { colour: SERIES_COLOURS.reference, words: 'reference' },
];

/** The map's scale as on screen: a bar `px` long stands for `metres`. */
export interface MapScale {
  px: number;
  metres: number;
}

function keySvg(top: number, scale: MapScale | null): string {
  const swatches = KEY.map(({ colour, words }, index) => {
    const x = 8 + index * 150;
    return `<rect x="${x}" y="${top + 6}" width="10" height="10" fill="${colour}"/><text x="${x + 14}" y="${top + 15}" font-size="12" fill="#1f2733">${escapeXml(words)}</text>`;
  }).join('');
  if (!scale) return swatches;
  const x = 8 + KEY.length * 150;
  const bar = `<path d="M${x} ${top + 8}v6h${scale.px}v-6" fill="none" stroke="#1f2733" stroke-width="2"/>`;
  return `${swatches}${bar}<text x="${x + scale.px + 6}" y="${top + 15}" font-size="12" fill="#1f2733">${scale.metres} m</text>`;
}

/**
 * The map as a standalone SVG document: the canvas's pixels as they are drawn now (CSS size,
 * full device resolution), the caption above and the colour key and scale bar below. The drawing itself is a
 * raster inside the SVG, so the file shows exactly what was on screen.
 */
export function mapPictureSvg(canvas: HTMLCanvasElement, caption: string, scale: MapScale | null): string {
  const width = canvas.clientWidth || canvas.width;
  const height = canvas.clientHeight || canvas.height;
  const image = `<image x="0" y="0" width="${width}" height="${height}" href="${canvas.toDataURL('image/png')}"/>`;
  return captionedSvg({
    width,
    height: height + KEY_BAND,
    caption,
    body: `${image}${keySvg(height, scale)}`,
  });
}
