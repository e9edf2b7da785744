/** Okabe–Ito colours, matching the web app's series palette (readable with colour-vision deficiency). */
export const SERIES_COLOURS = {
  replay: '#0072B2',
  onboard: '#E69F00',
  reference: '#009E73',
  flag: '#D55E00',
  event: '#CC79A7',
} as const;

/** Escapes text for HTML and SVG content and attributes. */
export function escapeHtml(value: unknown): string {
  return String(value ?? '')
    .replaceAll('&', '&amp;')
    .replaceAll('<', '&lt;')
    .replaceAll('>', '&gt;')
    .replaceAll('"', '&quot;')
    .replaceAll("'", '&#39;');
}

/** Fixed-precision number for figures; `–` when undefined. */
export function formatNumber(value: number | null | undefined, digits = 2): string {
  return value === null || value === undefined || !Number.isFinite(value) ? '–' : value.toFixed(digits);
}
