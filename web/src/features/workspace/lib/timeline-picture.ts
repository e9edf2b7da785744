import { captionedSvg } from './picture-svg';

/** Presentation properties the app sets through CSS classes; copied inline so the file needs no stylesheet. */
const STYLE_PROPERTIES = [
  'fill',
  'fill-opacity',
  'stroke',
  'stroke-width',
  'stroke-opacity',
  'stroke-dasharray',
  'opacity',
  'font-size',
  'font-weight',
  'font-style',
  'text-anchor',
  'font-variant-numeric',
] as const;

/** Elements marked with this attribute (e.g. the zoom brush) are controls, not part of the picture. */
export const PICTURE_SKIP_ATTRIBUTE = 'data-picture-skip';

/** Copies `original`'s computed presentation onto its clone, depth first; drops hidden and skipped parts. */
function inlineStyles(original: Element, clone: Element) {
  const originals = Array.from(original.children);
  const clones = Array.from(clone.children);
  originals.forEach((child, index) => {
    const copy = clones[index];
    const style = getComputedStyle(child);
    if (child.hasAttribute(PICTURE_SKIP_ATTRIBUTE) || style.display === 'none') {
      copy.remove();
      return;
    }
    const inline = STYLE_PROPERTIES.map((name) => `${name}:${style.getPropertyValue(name)}`).join(';');
    copy.setAttribute('style', inline);
    for (const name of ['class', 'tabindex', 'role']) copy.removeAttribute(name);
    inlineStyles(child, copy);
  });
}

/**
 * The timeline as a standalone SVG document, its cursor drawn in, with the caption above it.
 * The on-screen cursor is an HTML overlay (so scrubbing never repaints the SVG); the picture
 * draws it as a line at the x the timeline reports in `data-cursor-x`.
 */
export function timelinePictureSvg(svg: SVGSVGElement, caption: string): string {
  const width = Number(svg.getAttribute('width'));
  const height = Number(svg.getAttribute('height'));
  const clone = svg.cloneNode(true) as SVGSVGElement;
  inlineStyles(svg, clone);
  const cursorX = Number(svg.dataset.cursorX);
  const cursor = Number.isFinite(cursorX)
    ? `<line x1="${cursorX}" x2="${cursorX}" y1="0" y2="${height}" stroke="#1f2733" stroke-width="2"/>`
    : '';
  return captionedSvg({ width, height, caption, body: `${clone.innerHTML}${cursor}` });
}
