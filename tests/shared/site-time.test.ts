import { describe, expect, it } from 'vitest';
import {
  describeTimeZone,
  formatSiteDateTime,
  formatUtcInstant,
  isKnownTimeZone,
  rfc3339ToSiteWallClock,
  siteWallClockToRfc3339,
  utcOffsetMinutes,
  zoneAbbreviation,
} from '../../shared/site-time';

// Expected values are worked out by hand from the published daylight-saving rules, not from the code:
// - EU: summer time from 01:00 UTC on the last Sunday of March to 01:00 UTC on the last Sunday of
//   October (Directive 2000/84/EC, articles 1-3). In 2026 those Sundays are 29 March and 25 October.
//   Central European Time is UTC+1 in winter (CET) and UTC+2 in summer (CEST).
// - USA: daylight time from 2:00 local on the second Sunday of March to 2:00 local on the first
//   Sunday of November (15 U.S.C. 260a, as amended by the Energy Policy Act of 2005, section 110).
//   In 2026 those are 8 March and 1 November. US Central is UTC-6 (CST) / UTC-5 (CDT).
// - India Standard Time is UTC+05:30 all year, without daylight saving (common knowledge, from memory).
describe('site time zone', () => {
  it('knows real zones and refuses made-up ones', () => {
    expect(isKnownTimeZone('Europe/Berlin')).toBe(true);
    expect(isKnownTimeZone('UTC')).toBe(true);
    expect(isKnownTimeZone('Mars/Olympus_Mons')).toBe(false);
  });

  it('gives the UTC offset on each side of the 2026 changes', () => {
    expect(utcOffsetMinutes(new Date('2026-03-29T00:59:59Z'), 'Europe/Berlin')).toBe(60);
    expect(utcOffsetMinutes(new Date('2026-03-29T01:00:00Z'), 'Europe/Berlin')).toBe(120);
    expect(utcOffsetMinutes(new Date('2026-10-25T00:59:59Z'), 'Europe/Berlin')).toBe(120);
    expect(utcOffsetMinutes(new Date('2026-10-25T01:00:00Z'), 'Europe/Berlin')).toBe(60);
    // 2:00 CST on 8 March 2026 is 08:00 UTC.
    expect(utcOffsetMinutes(new Date('2026-03-08T07:59:59Z'), 'America/Chicago')).toBe(-360);
    expect(utcOffsetMinutes(new Date('2026-03-08T08:00:00Z'), 'America/Chicago')).toBe(-300);
    expect(utcOffsetMinutes(new Date('2026-07-01T12:00:00Z'), 'Asia/Kolkata')).toBe(330);
  });

  it('formats an instant in the site zone with the zone named', () => {
    expect(formatSiteDateTime('2026-03-14T08:12:00.000Z', 'Europe/Berlin')).toBe('14 Mar 2026, 09:12 CET');
    expect(formatSiteDateTime('2026-07-14T08:12:00Z', 'Europe/Berlin')).toBe('14 Jul 2026, 10:12 CEST');
    expect(formatSiteDateTime('2026-03-14T08:12:00Z', 'America/Chicago')).toBe('14 Mar 2026, 03:12 CDT');
    expect(formatSiteDateTime('2026-11-16T06:40:00.000Z', 'UTC', { withSeconds: true })).toBe(
      '16 Nov 2026, 06:40:00 UTC',
    );
    // India has no common English short name in every locale, so the offset names it.
    expect(formatSiteDateTime('2026-03-14T08:12:00Z', 'Asia/Kolkata')).toMatch(
      /^14 Mar 2026, 13:42 (IST|UTC\+05:30)$/,
    );
    // An offset other than Z is the same instant: 09:12+01:00 is 08:12 UTC.
    expect(formatSiteDateTime('2026-03-14T09:12:00+01:00', 'UTC')).toBe('14 Mar 2026, 08:12 UTC');
    expect(formatUtcInstant('2026-03-14T09:12:00+01:00')).toBe('14 Mar 2026, 08:12:00 UTC');
    expect(formatSiteDateTime('not a time', 'UTC')).toBe('not a time');
  });

  it('names the zone in full', () => {
    expect(describeTimeZone('Europe/Berlin', new Date('2026-01-10T12:00:00Z'))).toBe(
      'Europe/Berlin (CET, UTC+01:00)',
    );
    expect(describeTimeZone('UTC')).toBe('UTC');
    expect(zoneAbbreviation(new Date('2026-07-01T12:00:00Z'), 'Europe/London')).toBe('BST');
  });

  it('reads a wall-clock input in the site zone, also around the changes', () => {
    expect(siteWallClockToRfc3339('2026-03-14T09:12', 'Europe/Berlin')).toBe('2026-03-14T09:12:00+01:00');
    expect(siteWallClockToRfc3339('2026-07-14T09:12:30', 'Europe/Berlin')).toBe('2026-07-14T09:12:30+02:00');
    expect(siteWallClockToRfc3339('2026-03-14T09:12', 'America/Chicago')).toBe('2026-03-14T09:12:00-05:00');
    expect(siteWallClockToRfc3339('2026-03-14T09:12', 'UTC')).toBe('2026-03-14T09:12:00+00:00');
    // 02:30 on 29 March 2026 does not exist in Berlin: clocks jump from 02:00 to 03:00.
    expect(siteWallClockToRfc3339('2026-03-29T02:30', 'Europe/Berlin')).toBe('2026-03-29T03:30:00+02:00');
    expect(siteWallClockToRfc3339('2026-02-30T09:00', 'Europe/Berlin')).toBeUndefined();
    expect(siteWallClockToRfc3339('14.03.2026 09:12', 'Europe/Berlin')).toBeUndefined();
    expect(rfc3339ToSiteWallClock('2026-03-14T08:12:00Z', 'Europe/Berlin')).toBe('2026-03-14T09:12');
  });
});
