/**
 * Times as people read them: in the site's time zone (one IANA zone set for the installation,
 * `SITE_TIME_ZONE`), with the zone named beside every time, so a screenshot or a printed report
 * cannot be misread by someone in another zone. Machines keep RFC 3339 (`<time datetime>`, JSON,
 * the archive's files). Pure apart from `Intl`, so the server (mails, report.html) and the browser
 * format alike.
 */

const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];

const pad = (value: number, width = 2) => String(Math.abs(value)).padStart(width, '0');

/** True for a zone this runtime knows (`Europe/Berlin`, `UTC`, `America/Chicago`). */
export function isKnownTimeZone(zone: string): boolean {
  try {
    new Intl.DateTimeFormat('en', { timeZone: zone });
    return true;
  } catch {
    return false;
  }
}

const partsFormatters = new Map<string, Intl.DateTimeFormat>();

function partsFormatter(zone: string): Intl.DateTimeFormat {
  let formatter = partsFormatters.get(zone);
  if (!formatter) {
    formatter = new Intl.DateTimeFormat('en-US', {
      timeZone: zone,
      hourCycle: 'h23',
      year: 'numeric',
      month: 'numeric',
      day: 'numeric',
      hour: 'numeric',
      minute: 'numeric',
      second: 'numeric',
    });
    partsFormatters.set(zone, formatter);
  }
  return formatter;
}

/** The wall-clock fields of an instant in a zone. */
export interface WallClock {
  year: number;
  month: number;
  day: number;
  hour: number;
  minute: number;
  second: number;
}

export function wallClockAt(instant: Date, zone: string): WallClock {
  const fields: Record<string, number> = {};
  for (const part of partsFormatter(zone).formatToParts(instant)) {
    if (part.type !== 'literal') fields[part.type] = Number(part.value);
  }
  return {
    year: fields.year,
    month: fields.month,
    day: fields.day,
    hour: fields.hour === 24 ? 0 : fields.hour,
    minute: fields.minute,
    second: fields.second,
  };
}

const wallClockAsUtcMs = (w: WallClock) => Date.UTC(w.year, w.month - 1, w.day, w.hour, w.minute, w.second);

/** Minutes east of UTC that `zone` is at `instant` (+60 for Berlin in winter, -300 for Chicago in summer). */
export function utcOffsetMinutes(instant: Date, zone: string): number {
  const wholeSeconds = Math.floor(instant.getTime() / 1000) * 1000;
  return Math.round((wallClockAsUtcMs(wallClockAt(new Date(wholeSeconds), zone)) - wholeSeconds) / 60_000);
}

/** `UTC+01:00`, `UTC-05:00`, `UTC+05:30`; `UTC` itself for zero. */
export function formatOffset(minutesEast: number): string {
  if (minutesEast === 0) return 'UTC';
  const sign = minutesEast < 0 ? '-' : '+';
  return `UTC${sign}${pad(Math.trunc(minutesEast / 60))}:${pad(minutesEast % 60)}`;
}

const ABBREVIATION = /^[A-Z]{2,5}$/;

/**
 * The zone's short name at an instant where one is in common use (CET, CEST, GMT, BST, CDT,
 * UTC), else its offset (`UTC+09:00`): the CLDR short names differ between English locales, so
 * British English is asked first, then US English, and a `GMT+9` style answer becomes the offset.
 */
export function zoneAbbreviation(instant: Date, zone: string): string {
  for (const locale of ['en-GB', 'en-US']) {
    const name = new Intl.DateTimeFormat(locale, { timeZone: zone, timeZoneName: 'short' })
      .formatToParts(instant)
      .find((part) => part.type === 'timeZoneName')?.value;
    if (name && ABBREVIATION.test(name) && name !== 'GMT') return name;
    if (name === 'GMT' && utcOffsetMinutes(instant, zone) === 0) return zone === 'UTC' ? 'UTC' : 'GMT';
  }
  return formatOffset(utcOffsetMinutes(instant, zone));
}

export interface SiteTimeOptions {
  /** Adds `:ss`; for audit entries and signatures, where seconds matter. */
  withSeconds?: boolean;
  /** Leaves the zone off, for a column whose header names it. */
  withoutZone?: boolean;
}

/** `14 Mar 2026, 09:12 CET` for an RFC 3339 instant; the input unchanged if it is not a time. */
export function formatSiteDateTime(iso: string, zone: string, options: SiteTimeOptions = {}): string {
  const instant = new Date(iso);
  if (Number.isNaN(instant.getTime())) return iso;
  const w = wallClockAt(instant, zone);
  const time = `${pad(w.hour)}:${pad(w.minute)}${options.withSeconds ? `:${pad(w.second)}` : ''}`;
  const text = `${w.day} ${MONTHS[w.month - 1]} ${w.year}, ${time}`;
  return options.withoutZone ? text : `${text} ${zoneAbbreviation(instant, zone)}`;
}

/** `14 Mar 2026` in the site's zone. */
export function formatSiteDate(iso: string, zone: string): string {
  const instant = new Date(iso);
  if (Number.isNaN(instant.getTime())) return iso;
  const w = wallClockAt(instant, zone);
  return `${w.day} ${MONTHS[w.month - 1]} ${w.year}`;
}

/** `14 Mar 2026, 08:12:00 UTC`: the same instant in UTC, for hover text beside a site time. */
export function formatUtcInstant(iso: string): string {
  return formatSiteDateTime(iso, 'UTC', { withSeconds: true });
}

/** `Europe/Berlin (CET, UTC+01:00)`: the zone named in full, as shown beside time inputs and in headers. */
export function describeTimeZone(zone: string, at: Date = new Date()): string {
  const abbreviation = zoneAbbreviation(at, zone);
  const offset = formatOffset(utcOffsetMinutes(at, zone));
  if (zone === 'UTC' || zone === 'Etc/UTC') return 'UTC';
  return abbreviation === offset ? `${zone} (${offset})` : `${zone} (${abbreviation}, ${offset})`;
}

const WALL_CLOCK_INPUT = /^(\d{4})-(\d{2})-(\d{2})T(\d{2}):(\d{2})(?::(\d{2}))?$/;

/**
 * A wall-clock value typed in the site's zone (`2026-03-14T09:12`, as a `datetime-local` input
 * gives it) as RFC 3339 with that zone's offset at that moment, e.g. `2026-03-14T09:12:00+01:00`;
 * `undefined` when it is malformed or not a real day. A time skipped by a daylight-saving jump
 * is moved forward by the jump, as clocks are.
 */
export function siteWallClockToRfc3339(value: string, zone: string): string | undefined {
  const match = WALL_CLOCK_INPUT.exec(value);
  if (!match) return undefined;
  const [year, month, day, hour, minute, second] = match.slice(1).map((part) => Number(part ?? 0));
  const asUtc = Date.UTC(year, month - 1, day, hour, minute, second);
  const check = new Date(asUtc);
  const isRealDay =
    check.getUTCFullYear() === year && check.getUTCMonth() === month - 1 && check.getUTCDate() === day;
  if (!isRealDay || hour > 23 || minute > 59 || second > 59) return undefined;
  // Two passes settle the offset at the instant itself, also next to a daylight-saving change.
  let instant = asUtc - utcOffsetMinutes(new Date(asUtc), zone) * 60_000;
  instant = asUtc - utcOffsetMinutes(new Date(instant), zone) * 60_000;
  const offset = utcOffsetMinutes(new Date(instant), zone);
  const w = wallClockAt(new Date(instant), zone);
  const numericOffset = formatOffset(offset).replace('UTC', '') || '+00:00';
  return `${w.year}-${pad(w.month)}-${pad(w.day)}T${pad(w.hour)}:${pad(w.minute)}:${pad(w.second)}${numericOffset}`;
}

/** The reverse, for filling a `datetime-local` input from a stored instant: `2026-03-14T09:12`. */
export function rfc3339ToSiteWallClock(iso: string, zone: string): string {
  const w = wallClockAt(new Date(iso), zone);
  return `${w.year}-${pad(w.month)}-${pad(w.day)}T${pad(w.hour)}:${pad(w.minute)}`;
}
