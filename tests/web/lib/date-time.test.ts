import { ZRfc3339 } from '@shared/contracts/cases';
import {
  formatUtcDateTime,
  formatUtcOffset,
  isLocalDateTimeInput,
  localInputToRfc3339,
} from '@web/lib/date-time';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';

// Node re-reads process.env.TZ when it is assigned, so each case can pin the browser's zone.
const originalZone = process.env.TZ;
function inZone(zone: string) {
  process.env.TZ = zone;
}

describe('localInputToRfc3339', () => {
  beforeEach(() => inZone('UTC'));
  afterEach(() => {
    process.env.TZ = originalZone;
  });

  it('reproduces the RFC 3339 worked example for US Pacific Standard Time', () => {
    // RFC 3339 (2002), section 5.8: "1996-12-19T16:39:57-08:00 ... is equal to 1996-12-20T00:39:57Z".
    inZone('America/Los_Angeles');
    const converted = localInputToRfc3339('1996-12-19T16:39:57');
    expect(converted).toBe('1996-12-19T16:39:57-08:00');
    expect(Date.parse(converted)).toBe(Date.parse('1996-12-20T00:39:57Z'));
  });

  it('uses the summer offset on a daylight-saving date in the same zone', () => {
    // US daylight saving time runs from the second Sunday of March to the first Sunday of November
    // (Energy Policy Act of 2005, section 110); Pacific Daylight Time is UTC-07:00.
    inZone('America/Los_Angeles');
    expect(localInputToRfc3339('2026-07-01T12:00')).toBe('2026-07-01T12:00:00-07:00');
  });

  it('writes half-hour offsets with their minutes', () => {
    // India Standard Time is UTC+05:30 all year (IANA tz database, zone Asia/Kolkata).
    inZone('Asia/Kolkata');
    const converted = localInputToRfc3339('2026-03-14T09:12');
    expect(converted).toBe('2026-03-14T09:12:00+05:30');
    expect(formatUtcDateTime(converted)).toBe('2026-03-14 03:42:00 UTC');
  });

  it('always yields a string the shared RFC 3339 schema accepts, naming the same instant', () => {
    for (const zone of ['UTC', 'Europe/Berlin', 'America/St_Johns', 'Pacific/Auckland']) {
      inZone(zone);
      const local = '2026-11-14T23:59:30';
      const converted = localInputToRfc3339(local);
      expect(ZRfc3339.safeParse(converted).success).toBe(true);
      expect(Date.parse(converted)).toBe(new Date(2026, 10, 14, 23, 59, 30).getTime());
    }
  });

  it('refuses text that is not a real local date-time', () => {
    expect(() => localInputToRfc3339('14/03/2026 09:12')).toThrow(/Not a local date-time/);
  });
});

describe('isLocalDateTimeInput', () => {
  it('follows the Gregorian leap-year rule', () => {
    // Gregorian calendar (1582): a year divisible by 4 is a leap year, except centuries not divisible by 400.
    expect(isLocalDateTimeInput('2024-02-29T10:00')).toBe(true);
    expect(isLocalDateTimeInput('2026-02-29T10:00')).toBe(false);
    expect(isLocalDateTimeInput('2100-02-29T10:00')).toBe(false);
    expect(isLocalDateTimeInput('2000-02-29T10:00')).toBe(true);
  });

  it('rejects impossible clock times and missing parts', () => {
    expect(isLocalDateTimeInput('2026-03-14T24:00')).toBe(false);
    expect(isLocalDateTimeInput('2026-03-14T09:60')).toBe(false);
    expect(isLocalDateTimeInput('2026-03-14')).toBe(false);
    expect(isLocalDateTimeInput('')).toBe(false);
  });
});

describe('formatUtcOffset', () => {
  it('formats RFC 3339 time-numoffset for east, west and zero offsets', () => {
    // RFC 3339 (2002), section 5.6: time-numoffset = ("+" / "-") time-hour ":" time-minute.
    expect(formatUtcOffset(0)).toBe('+00:00');
    expect(formatUtcOffset(330)).toBe('+05:30');
    expect(formatUtcOffset(-210)).toBe('-03:30');
    expect(formatUtcOffset(-480)).toBe('-08:00');
  });
});
