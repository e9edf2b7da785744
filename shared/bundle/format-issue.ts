import type { BundleIssue } from './types';

/**
 * One line per issue in the compiler style `file:line: field: message (expected X, found Y)`,
 * leaving out the parts that do not apply, so editors and people can jump to the spot.
 */
export function formatIssue(issue: BundleIssue): string {
  const location = issue.line === undefined ? issue.file : `${issue.file}:${issue.line}`;
  const parts = [location];
  if (issue.field) parts.push(issue.field);
  let message = issue.severity === 'warning' ? `warning: ${issue.message}` : issue.message;
  const details: string[] = [];
  if (issue.expected !== undefined) details.push(`expected ${issue.expected}`);
  if (issue.found !== undefined) details.push(`found ${issue.found}`);
  if (details.length > 0) message += ` (${details.join(', ')})`;
  parts.push(message);
  return parts.join(': ');
}

/** Short, printable excerpt of user data for `found`, so a huge cell cannot flood a report. */
export function quoteFound(value: string, maxLength = 40): string {
  const shown = value.length > maxLength ? `${value.slice(0, maxLength)}...` : value;
  return JSON.stringify(shown);
}
