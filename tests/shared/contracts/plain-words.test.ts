import { installPlainWords, plainIssueMessage } from '@shared/contracts/plain-words';
import { beforeAll, describe, expect, it } from 'vitest';
import { z } from 'zod';

// The developer wordings below are quoted from zod 4's own English locale (the messages the
// issue saw reach users); the check is that none of them reaches a person any more, and that the
// sentence keeps what a person needs (the options, the limit).
const DEVELOPER_WORDING =
  /Invalid option|Invalid input|expected string|received undefined|Too small|Too big|expected number|Unrecognized key|>=|<=/;

function messageOf(schema: z.ZodType, value: unknown): string {
  const result = schema.safeParse(value);
  if (result.success) throw new Error('expected the value to be refused');
  return result.error.issues[0].message;
}

describe('plain words for validation issues', () => {
  beforeAll(() => installPlainWords());

  it('names the choices of an enum as words', () => {
    const kind = z.enum(['odometry_fault', 'map_out_of_date', 'sensor_degraded']);
    const message = messageOf(kind, 'other');
    expect(message).not.toMatch(DEVELOPER_WORDING);
    expect(message).toBe('Choose one of: odometry fault, map out of date or sensor degraded');
  });

  it('says a missing field is required', () => {
    const message = messageOf(z.strictObject({ title: z.string() }), {});
    expect(message).toBe('This is required');
  });

  it('states number limits as a person writes them', () => {
    expect(messageOf(z.number().min(1), 0)).toBe('This must be 1 or more');
    expect(messageOf(z.number().max(271), 9999)).toBe('This must be 271 or less');
    expect(messageOf(z.number().positive(), 0)).toBe('This must be more than 0');
    expect(messageOf(z.number().int(), 1.5)).not.toMatch(DEVELOPER_WORDING);
  });

  it('states text lengths and formats', () => {
    expect(messageOf(z.string().min(3), 'ab')).toBe('This needs at least 3 characters');
    expect(messageOf(z.string().min(1), '')).toBe('This cannot be empty');
    expect(messageOf(z.email(), 'not-mail')).toMatch(/e-mail address/);
    expect(messageOf(z.uuid(), 'abc')).not.toMatch(DEVELOPER_WORDING);
  });

  it('asks for a tick on a literal true (a confirmation box)', () => {
    expect(messageOf(z.literal(true), false)).toBe('This must be ticked (confirmed) to go on');
  });

  it('names unknown fields', () => {
    expect(messageOf(z.strictObject({ a: z.number() }), { a: 1, extra: 2 })).toBe(
      'Not a field this accepts: extra; remove it',
    );
  });

  it('keeps a schema’s own message', () => {
    expect(messageOf(z.string().min(3, 'Title needs at least 3 characters'), 'a')).toBe(
      'Title needs at least 3 characters',
    );
  });

  it('leaves codes it does not know to zod (undefined)', () => {
    expect(plainIssueMessage({ code: 'custom', input: 1, path: [] } as never)).toBeUndefined();
  });
});
