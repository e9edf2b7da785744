/**
 * Times in Driftcase travel as RFC 3339 strings with an explicit offset. Investigators type and read
 * local wall-clock time; UTC is always one hover away, because reports compare logs across sites.
 */

const pad = (value: number, width = 2) => String(Math.abs(value)).padStart(width, '0');

/** `±hh:mm` for an offset given in minutes east of UTC (RFC 3339 section 5.6 `time-numoffset`). */
export function formatUtcOffset(minutesEast: number): string {
  const sign = minutesEast < 0 ? '-' : '+';
  return `${sign}${pad(Math.trunc(minutesEast / 60))}:${pad(minutesEast % 60)}`;
}

const LOCAL_INPUT = /^(\d{4})-(\d{2})-(\d{2})T(\d{2}):(\d{2})(?::(\d{2}))?$/;

/** Parses a local wall-clock value into a Date, or `undefined` if it is malformed or not a real day. */
function parseLocalInput(value: string): Date | undefined {
  const match = LOCAL_INPUT.exec(value);
  if (!match) return undefined;
  const [year, month, day, hour, minute, second] = match.slice(1).map((part) => Number(part ?? 0));
  const date = new Date(year, month - 1, day, hour, minute, second);
  const isRealDay = date.getFullYear() === year && date.getMonth() === month - 1 && date.getDate() === day;
  return isRealDay && hour < 24 && minute < 60 && second < 60 ? date : undefined;
}

/** True for the value of an `<input type="datetime-local">`: `YYYY-MM-DDTHH:mm` with optional `:ss`. */
export function isLocalDateTimeInput(value: string): boolean {
  return parseLocalInput(value) !== undefined;
}

/**
 * Converts a `datetime-local` value, read in the browser's time zone, to RFC 3339 with that zone's
 * offset at that instant (so daylight-saving dates get their own offset), e.g. `2026-03-14T09:12:00+01:00`.
 */
export function localInputToRfc3339(value: string): string {
  const date = parseLocalInput(value);
  if (!date) throw new Error(`Not a local date-time: "${value}"`);
  const offset = formatUtcOffset(-date.getTimezoneOffset());
  // Wall-clock fields come from the Date, not the text, so a time skipped by a DST jump is normalised.
  return `${date.getFullYear()}-${pad(date.getMonth() + 1)}-${pad(date.getDate())}T${pad(date.getHours())}:${pad(date.getMinutes())}:${pad(date.getSeconds())}${offset}`;
}

/** The reverse, for filling a `datetime-local` input from a stored instant. */
export function rfc3339ToLocalInput(iso: string): string {
  const date = new Date(iso);
  return `${date.getFullYear()}-${pad(date.getMonth() + 1)}-${pad(date.getDate())}T${pad(date.getHours())}:${pad(date.getMinutes())}`;
}

/** `2026-03-14 09:12` in the browser's time zone; unambiguous in tables and screenshots. */
export function formatLocalDateTime(iso: string): string {
  const date = new Date(iso);
  if (Number.isNaN(date.getTime())) return iso;
  return `${date.getFullYear()}-${pad(date.getMonth() + 1)}-${pad(date.getDate())} ${pad(date.getHours())}:${pad(date.getMinutes())}`;
}

/** `2026-03-14 08:12:00 UTC`, for hover text and exports. */
export function formatUtcDateTime(iso: string): string {
  const date = new Date(iso);
  if (Number.isNaN(date.getTime())) return iso;
  return `${date.toISOString().slice(0, 19).replace('T', ' ')} UTC`;
}

/** The browser's zone and its current offset, shown beside time inputs: `Europe/Berlin, UTC+01:00`. */
export function describeLocalTimeZone(at: Date = new Date()): string {
  const zone = Intl.DateTimeFormat().resolvedOptions().timeZone;
  return `${zone}, UTC${formatUtcOffset(-at.getTimezoneOffset())}`;
}
