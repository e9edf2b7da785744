/**
 * Bad input in a robot recording, map or parameter file. The message names the file and, where
 * known, the topic and the message time, so an investigator can find the place with ROS tools.
 */
export class RecordingError extends Error {
  constructor(
    message: string,
    readonly where: { file: string; topic?: string; timeNs?: bigint; field?: string } = { file: '' },
  ) {
    super(formatWhere(where, message));
    this.name = 'RecordingError';
  }
}

/** `file: topic /scan at 1700000000.123456789 s: message`. */
function formatWhere(where: RecordingError['where'], message: string): string {
  const parts = [where.file || '(input)'];
  if (where.topic) parts.push(`topic ${where.topic}`);
  if (where.timeNs !== undefined) parts.push(`message time ${formatStampNs(where.timeNs)}`);
  if (where.field) parts.push(where.field);
  return `${parts.join(': ')}: ${message}`;
}

/** Seconds since the epoch with nine decimals, the form `ros2 bag info` users compare with. */
export function formatStampNs(ns: bigint): string {
  const negative = ns < 0n;
  const abs = negative ? -ns : ns;
  return `${negative ? '-' : ''}${abs / 1_000_000_000n}.${(abs % 1_000_000_000n).toString().padStart(9, '0')} s`;
}
