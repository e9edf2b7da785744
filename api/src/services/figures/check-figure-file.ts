import fs from 'node:fs';
import type { TFigureMediaType } from '../../../../shared/contracts/figures';
import { AppError } from '../../../../shared/errors';

/** The eight bytes every PNG starts with, then the IHDR chunk's name (PNG specification, 5.2 and 11.2.2). */
const PNG_SIGNATURE = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
/**
 * An SVG document: optional BOM, XML declaration, comments and DOCTYPE, then the `<svg` root.
 * A DOCTYPE is recognised here only so that the refusal below can name it.
 */
const SVG_START =
  /^\uFEFF?\s*(<\?xml[^>]*\?>\s*)?(<!--[\s\S]*?-->\s*|<!DOCTYPE[^[>]*(\[[\s\S]*?\])?\s*>\s*)*<svg[\s>]/i;

/**
 * Parts of SVG that can run code, load something from elsewhere or rewrite the picture, each with
 * the plain words the refusal uses. A map or timeline picture needs none of them, so an SVG holding
 * one is refused rather than cleaned: a cleaned file would no longer be the bytes that were sent.
 */
const ACTIVE_SVG: { pattern: RegExp; words: string }[] = [
  { pattern: /<!DOCTYPE|<!ENTITY/i, words: 'a DOCTYPE or entity declaration' },
  { pattern: /<\s*(svg:)?script[\s>/]/i, words: 'a <script> element' },
  {
    pattern: /<\s*(svg:)?foreignObject[\s>/]/i,
    words: 'a <foreignObject> element (HTML inside the picture)',
  },
  {
    pattern: /<\s*(svg:)?(iframe|embed|object|audio|video|handler|listener)[\s>/]/i,
    words: 'an embedded document or media element',
  },
  {
    pattern: /<\s*(svg:)?(animate\w*|set)[\s>/]/i,
    words: 'an animation element (it can change links after loading)',
  },
  { pattern: /\son[a-z]+\s*=/i, words: 'an event-handler attribute (on…=)' },
  { pattern: /javascript:|vbscript:/i, words: 'a script address (javascript:)' },
  { pattern: /@import|url\(\s*['"]?(?!#)/i, words: 'a style that loads something from another address' },
];

/** Only links inside the file, or a picture carried in the file itself, may be referenced. */
const ALLOWED_HREF = /^(#|data:image\/(png|jpeg);base64,)/i;
const HREF_ATTRIBUTE = /\b(?:xlink:)?href\s*=\s*(?:"([^"]*)"|'([^']*)')/gi;

const decodeReferences = (value: string) =>
  value
    .replace(/&#x([0-9a-f]+);?/gi, (_, hex) => String.fromCodePoint(Number.parseInt(hex, 16)))
    .replace(/&#(\d+);?/g, (_, dec) => String.fromCodePoint(Number(dec)))
    .replace(/\s+/g, '');

function refuse(message: string): AppError {
  return new AppError('validation_failed', `Invalid request: figure: ${message}.`, [
    { path: 'figure', field: 'figure', message },
  ]);
}

/** Why this SVG text cannot be kept as a figure, or null when it is a plain picture. */
export function activeSvgReason(text: string): string | null {
  const found = ACTIVE_SVG.find(({ pattern }) => pattern.test(text));
  if (found) return found.words;
  for (const match of text.matchAll(HREF_ATTRIBUTE)) {
    const target = decodeReferences(match[1] ?? match[2] ?? '');
    if (!ALLOWED_HREF.test(target)) return `a link to another address (${target.slice(0, 60)})`;
  }
  return null;
}

/**
 * Reads the uploaded file and says what kind of picture it is, by its bytes, never by its name or
 * the type the browser claimed. Anything but a PNG or a plain SVG is refused in plain words.
 */
export async function checkFigureFile(file: string): Promise<TFigureMediaType> {
  const bytes = await fs.promises.readFile(file);
  if (bytes.length === 0) throw refuse('the file is empty; export the picture again and attach it');
  if (bytes.subarray(0, 8).equals(PNG_SIGNATURE)) {
    if (bytes.length < 33 || bytes.toString('latin1', 12, 16) !== 'IHDR')
      throw refuse('the file starts like a PNG but is cut short or damaged');
    return 'image/png';
  }
  const text = bytes.toString('utf8');
  if (!SVG_START.test(text)) {
    throw refuse('only PNG and SVG pictures can be saved as figures, and this file is neither');
  }
  const reason = activeSvgReason(text);
  if (reason) {
    throw refuse(
      `the SVG holds ${reason}, which could run or fetch something when opened; export the picture again from the workspace, or save it as PNG`,
    );
  }
  return 'image/svg+xml';
}
