import { AUDIT_ACTIONS } from '../../shared/audit-actions';
import { KNOWN_EVENT_KINDS } from '../../shared/bundle/table-specs';
import { CASE_EVENTS } from '../../shared/case-lifecycle';
import { BUNDLE_STATUSES } from '../../shared/contracts/bundles';
import { CASE_STAGES, CASE_STATUSES, SEVERITIES } from '../../shared/contracts/cases';
import { VERSION_STATES } from '../../shared/contracts/findings';
import { REPLAY_STATUSES } from '../../shared/contracts/replays';
import { CAUSE_KIND_LABELS, FLAG_KIND_LABELS } from '../../shared/human-labels';
import { ROLES } from '../../shared/roles';

/**
 * Finds what a person should never read: stored codes (`signed_off`, `saved_query.create`) and
 * unformatted RFC 3339 timestamps (`2026-11-16T06:40:00.000Z`, RFC 3339 section 5.6: full-date
 * "T" full-time). Used on the rendered text of every page, mail and report.html.
 */

const CODES = [
  ...AUDIT_ACTIONS,
  ...CASE_STATUSES,
  ...SEVERITIES,
  ...REPLAY_STATUSES,
  ...VERSION_STATES,
  ...BUNDLE_STATUSES,
  ...KNOWN_EVENT_KINDS,
  ...CASE_EVENTS,
  ...CASE_STAGES,
  ...ROLES,
  ...Object.keys(FLAG_KIND_LABELS),
  ...Object.keys(CAUSE_KIND_LABELS),
  'info',
  'warning',
  'signoff',
];

/** Codes with `_` or `.` are never words: found anywhere, as a whole token. */
const COMPOUND = [...new Set(CODES.filter((code) => /[._]/.test(code)))];
/** One-word codes (`open`, `high`) are also English words: found only as a whole text of their own. */
const SINGLE = new Set(CODES.filter((code) => !/[._]/.test(code)));

const escapeRegExp = (text: string) => text.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
const COMPOUND_PATTERN = new RegExp(
  `(?<![\\w.@/-])(${COMPOUND.map(escapeRegExp).join('|')})(?![\\w-]|\\.\\w)`,
  'g',
);

/** `YYYY-MM-DDTHH:MM` — the part of an RFC 3339 date-time that no human format here writes. */
export const RFC3339_PATTERN =
  /\d{4}-\d{2}-\d{2}[Tt]\d{2}:\d{2}(?::\d{2}(?:\.\d+)?)?(?:[Zz]|[+-]\d{2}:\d{2})?/g;

/** Every raw value in a list of text pieces (text nodes, or lines), each with the piece it is in. */
export function findRawValues(pieces: readonly string[]): string[] {
  const found: string[] = [];
  for (const piece of pieces) {
    const text = piece.trim();
    if (!text) continue;
    if (SINGLE.has(text)) found.push(`code "${text}"`);
    for (const match of text.matchAll(COMPOUND_PATTERN))
      found.push(`code "${match[1]}" in "${text.slice(0, 120)}"`);
    for (const match of text.matchAll(RFC3339_PATTERN))
      found.push(`timestamp "${match[0]}" in "${text.slice(0, 120)}"`);
  }
  return found;
}

/** The text nodes of an HTML document, without tags, attributes, styles or scripts. */
export function htmlTextPieces(html: string): string[] {
  const body = html
    .replace(/<(style|script)[^>]*>[\s\S]*?<\/\1>/gi, '')
    .replace(/<title>[\s\S]*?<\/title>/gi, (title) => title.replace(/<\/?title>/g, '\n'));
  return body
    .split(/<[^>]*>/)
    .map((piece) =>
      piece
        .replaceAll('&lt;', '<')
        .replaceAll('&gt;', '>')
        .replaceAll('&quot;', '"')
        .replaceAll('&#39;', "'")
        .replaceAll('&amp;', '&'),
    );
}
