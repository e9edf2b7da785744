import { stat } from 'node:fs/promises';
import { formatIssue } from '@shared/bundle/format-issue';
import { type BundleInspection, inspectBundle } from '../../bundles/inspect-bundle';

const USAGE = 'Usage: npm run cli -- check PATH [--json]   (PATH: a bundle .zip or folder)\n';

/**
 * `check PATH [--json]`: validates an incident bundle. Exit 0 valid, 2 invalid or bad usage,
 * 1 internal failure. Issues go to stderr as `file:line: field: message`, one per line.
 */
export async function run(args: string[]): Promise<number> {
  const isJson = args.includes('--json');
  const unknownOptions = args.filter((arg) => arg.startsWith('-') && arg !== '--json');
  const paths = args.filter((arg) => !arg.startsWith('-'));
  if (unknownOptions.length > 0 || paths.length !== 1) {
    const problem =
      unknownOptions.length > 0 ? `Unknown option ${unknownOptions[0]}.` : 'Give exactly one PATH.';
    process.stderr.write(`${problem}\n${USAGE}`);
    return 2;
  }
  const path = paths[0];
  try {
    const info = await stat(path).catch(() => undefined);
    if (!info) {
      process.stderr.write(`${path}: no such file or folder\n`);
      return 2;
    }
    const inspection = await inspectBundle({ kind: info.isDirectory() ? 'folder' : 'zip', path });
    if (isJson) {
      const { bundle: _typedArrays, ...printable } = inspection;
      process.stdout.write(`${JSON.stringify(printable, null, 2)}\n`);
    } else {
      process.stdout.write(formatReport(path, inspection));
    }
    for (const issue of inspection.issues) process.stderr.write(`${formatIssue(issue)}\n`);
    return inspection.ok ? 0 : 2;
  } catch (error) {
    process.stderr.write(`Internal failure while checking ${path}: ${(error as Error).message}\n`);
    return 1;
  }
}

/** Human-readable report; numbers carry their units. */
export function formatReport(path: string, inspection: BundleInspection): string {
  const errors = inspection.issues.filter((issue) => issue.severity !== 'warning').length;
  const warnings = inspection.issues.length - errors;
  const lines = [`Bundle ${path}`];
  lines.push(
    inspection.ok
      ? `Status: VALID${warnings ? ` (${warnings} warning${warnings === 1 ? '' : 's'})` : ''}`
      : `Status: INVALID (${errors} error${errors === 1 ? '' : 's'}${warnings ? `, ${warnings} warnings` : ''}; listed on stderr)`,
  );
  const { summary } = inspection;
  if (summary) {
    lines.push(`Robot: ${summary.robotId} at ${summary.site}, recording started ${summary.startTime}`);
    if (summary.timeSpan) {
      const { start, end } = summary.timeSpan;
      lines.push(
        `Time span: ${start.toFixed(3)} s to ${end.toFixed(3)} s (duration ${summary.durationSeconds.toFixed(3)} s)`,
      );
    }
    lines.push(`Sensors: ${summary.sensors.join(', ')}`);
    lines.push('Rows:');
    for (const [table, rows] of Object.entries(summary.rows))
      lines.push(`  ${table.padEnd(16)}${String(rows).padStart(10)}`);
    const events = Object.entries(summary.eventCounts).map(([kind, count]) => `${kind} ${count}`);
    if (events.length > 0) lines.push(`Events: ${events.join(', ')}`);
  }
  if (inspection.files.length > 0) {
    lines.push('Files (size in bytes, SHA-256):');
    for (const file of inspection.files)
      lines.push(`  ${String(file.size).padStart(12)}  ${file.sha256}  ${file.name}`);
  }
  return `${lines.join('\n')}\n`;
}
