/**
 * The Driftcase mark for report.html (the web app draws the same in web/src/components/logo.tsx):
 * a robot's pose inside its uncertainty ellipse, with the dashed trail it drifted along.
 */
export const REPORT_BRAND_MARK =
  '<svg class="mark" width="28" height="28" viewBox="0 0 32 32" aria-hidden="true"><rect width="32" height="32" rx="7" fill="#1f2d3f"/><ellipse cx="19" cy="13" rx="8" ry="5" transform="rotate(-25 19 13)" fill="#0072B2" fill-opacity="0.18" stroke="#0072B2" stroke-width="1.8"/><path d="M5 26c4-1 7-4 9-8" fill="none" stroke="#a9b8cc" stroke-width="2" stroke-dasharray="2 3" stroke-linecap="round"/><path d="M24.5 7.5L13 13l4.5 1.5 1.5 4.5z" fill="#E69F00"/></svg>';
