import type { QueryCell } from '@shared/query-result-hash';
import { formatCell } from './format-cell';

/** Quotes a field when it holds a comma, quote or line break, doubling inner quotes (RFC 4180 section 2). */
function csvField(text: string): string {
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

/** The result as RFC 4180 CSV with a header row and CRLF line ends; lists and structs as JSON text. */
export function resultToCsv(columns: readonly string[], rows: readonly QueryCell[][]): string {
  const lines = [columns.map(csvField).join(',')];
  for (const row of rows) lines.push(row.map((cell) => csvField(formatCell(cell))).join(','));
  return `${lines.join('\r\n')}\r\n`;
}
