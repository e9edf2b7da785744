/** Height of the caption band printed above every exported picture, px. */
export const CAPTION_BAND = 24;

const SVG_NS = 'http://www.w3.org/2000/svg';

/** Text safe inside an XML text node or attribute. */
export function escapeXml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);
}

/**
 * A standalone SVG document: a white page, the caption band on top and `body` (SVG markup,
 * drawn in its own coordinates) below it. Standalone means no styles or fonts from the app: a
 * reader opening the file later sees the same picture.
 */
export function captionedSvg(options: { width: number; height: number; caption: string; body: string }) {
  const { width, height, caption, body } = options;
  const total = height + CAPTION_BAND;
  return `<svg xmlns="${SVG_NS}" width="${width}" height="${total}" viewBox="0 0 ${width} ${total}" font-family="Lato, 'Helvetica Neue', Arial, sans-serif">
<title>${escapeXml(caption)}</title>
<rect width="${width}" height="${total}" fill="#ffffff"/>
<text x="8" y="16" font-size="12" font-weight="700" fill="#1f2733" data-caption="">${escapeXml(caption)}</text>
<g transform="translate(0, ${CAPTION_BAND})">${body}</g>
</svg>
`;
}
