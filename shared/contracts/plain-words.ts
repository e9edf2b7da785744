import { z } from 'zod';

/**
 * One mapping from validation issues to sentences a person understands, used by the API's error
 * details and by every form (installed once in each program with {@link installPlainWords}).
 * A schema's own message (`z.string().min(3, 'Title needs at least 3 characters')`) always
 * wins; this map only replaces zod's built-in developer wording ("Invalid option: expected one
 * of …", "Too small: expected number to be >=1"). The sentence is shown next to its field, so it
 * does not repeat the field's name.
 */
type RawIssue = z.core.$ZodRawIssue;

/** `odometry_fault` → `odometry fault`: option codes read as words. */
export function humanizeOption(value: unknown): string {
  if (typeof value === 'string') return value.replace(/[_-]+/g, ' ');
  return String(value);
}

function listOptions(values: readonly unknown[]): string {
  const words = values.map(humanizeOption);
  if (words.length <= 1) return words.join('');
  return `${words.slice(0, -1).join(', ')} or ${words.at(-1)}`;
}

const TYPE_SENTENCES: Record<string, string> = {
  string: 'This must be text',
  number: 'This must be a number',
  int: 'This must be a whole number',
  bigint: 'This must be a whole number',
  boolean: 'This must be yes or no (true or false)',
  array: 'This must be a list',
  object: 'This must be a group of fields',
  date: 'This must be a date',
};

const FORMAT_WORDS: Record<string, string> = {
  email: 'This must be an e-mail address, like name@example.com',
  uuid: 'This must be an identifier Driftcase gave (a UUID); pick the item from the list',
  guid: 'This must be an identifier Driftcase gave (a UUID); pick the item from the list',
  url: 'This must be a web address, like https://example.com/page',
  datetime: 'This must be a date and time, like 2026-11-16T13:47:52Z',
  date: 'This must be a date, like 2026-11-16',
  time: 'This must be a time, like 13:47:52',
  regex: 'This is not in the expected form',
};

function sizeWords(
  origin: string,
  limit: number | bigint,
  isExact: boolean | undefined,
  isMin: boolean,
  isInclusive = true,
) {
  const n = Number(limit);
  if (origin === 'string') {
    if (isExact) return `This needs exactly ${n} character${n === 1 ? '' : 's'}`;
    if (isMin) return n <= 1 ? 'This cannot be empty' : `This needs at least ${n} characters`;
    return `This allows at most ${n} characters`;
  }
  if (origin === 'array' || origin === 'set') {
    if (isExact) return `This needs exactly ${n} item${n === 1 ? '' : 's'}`;
    if (isMin) return n <= 1 ? 'This needs at least one item' : `This needs at least ${n} items`;
    return `This allows at most ${n} items`;
  }
  if (origin === 'file')
    return isMin ? `The file must be at least ${n} bytes` : `The file must be at most ${n} bytes`;
  if (origin === 'date') return isMin ? 'This date is too early' : 'This date is too late';
  if (isMin) return isInclusive ? `This must be ${n} or more` : `This must be more than ${n}`;
  return isInclusive ? `This must be ${n} or less` : `This must be less than ${n}`;
}

/** The plain sentence for one issue, or undefined to keep zod's (for codes not listed here). */
export function plainIssueMessage(issue: RawIssue): string | undefined {
  switch (issue.code) {
    case 'invalid_type': {
      if (issue.input === undefined) return 'This is required';
      if (issue.input === null) return 'This is required; it cannot be left empty';
      if (issue.expected === 'number' && typeof issue.input === 'number')
        return 'This must be a finite number';
      if (issue.expected === 'int') return 'This must be a whole number';
      return TYPE_SENTENCES[issue.expected] ?? `This must be ${humanizeOption(issue.expected)}`;
    }
    case 'invalid_value':
      if (issue.values.length === 1 && issue.values[0] === true)
        return 'This must be ticked (confirmed) to go on';
      if (issue.values.length === 1) return `This must be ${humanizeOption(issue.values[0])}`;
      return `Choose one of: ${listOptions(issue.values)}`;
    case 'too_small':
      return sizeWords(issue.origin, issue.minimum, issue.exact, true, issue.inclusive);
    case 'too_big':
      return sizeWords(issue.origin, issue.maximum, issue.exact, false, issue.inclusive);
    case 'invalid_format':
      if (issue.format === 'starts_with') return `This must start with "${issue.prefix}"`;
      if (issue.format === 'ends_with') return `This must end with "${issue.suffix}"`;
      if (issue.format === 'includes') return `This must contain "${issue.includes}"`;
      return FORMAT_WORDS[issue.format] ?? 'This is not in the expected form';
    case 'not_multiple_of':
      return `This must be a multiple of ${issue.divisor}`;
    case 'unrecognized_keys':
      return `Not a field this accepts: ${issue.keys.join(', ')}; remove ${issue.keys.length === 1 ? 'it' : 'them'}`;
    case 'invalid_union':
      return 'This value is not one of the accepted kinds';
    case 'invalid_key':
      return 'This field name is not accepted';
    case 'invalid_element':
      return 'One of the items is not valid';
    default:
      return undefined;
  }
}

let isInstalled = false;

/** Makes {@link plainIssueMessage} zod's global error map (idempotent; call at start-up). */
export function installPlainWords() {
  if (isInstalled) return;
  isInstalled = true;
  z.config({ customError: (issue) => plainIssueMessage(issue) });
}
