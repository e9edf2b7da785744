import { RecordingError } from './recording-error';

/**
 * `--from`/`--to`/event times: seconds from the recording's start (`12.5`) or an RFC 3339
 * instant (`2026-11-14T09:12:30.25Z`). Returns ns since the epoch.
 */
export function parseImportTime(text: string, recordingStartNs: bigint, option: string): bigint {
  if (/^[0-9]+(\.[0-9]+)?$/.test(text)) {
    const [whole, fraction = ''] = text.split('.');
    return recordingStartNs + BigInt(whole) * 1_000_000_000n + BigInt(fraction.padEnd(9, '0').slice(0, 9));
  }
  const match = /^(\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2})(\.\d+)?(Z|[+-]\d{2}:\d{2})$/.exec(text);
  const ms = match ? Date.parse(`${match[1]}${match[3]}`) : Number.NaN;
  if (!match || Number.isNaN(ms)) {
    throw new RecordingError(
      `expected seconds from the recording's start or an RFC 3339 time, found "${text}"`,
      {
        file: option,
      },
    );
  }
  const fraction = (match[2] ?? '.').slice(1).padEnd(9, '0').slice(0, 9);
  return BigInt(ms) * 1_000_000n + BigInt(fraction);
}

/** RFC 3339 in UTC with the nanoseconds the recording has (trailing zeros trimmed). */
export function formatRfc3339(ns: bigint): string {
  const ms = ns / 1_000_000n;
  const base = new Date(Number(ms)).toISOString().slice(0, 19);
  const fraction = (ns % 1_000_000_000n).toString().padStart(9, '0').replace(/0+$/, '');
  return `${base}${fraction ? `.${fraction}` : ''}Z`;
}
