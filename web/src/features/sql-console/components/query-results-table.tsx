import { Button } from '@web/components/button';
import { ChevronLeft, ChevronRight, Download } from 'lucide-react';
import { useState } from 'react';
import { formatCell } from '../lib/format-cell';
import type { QueryResult } from '../lib/query-result';
import { resultToCsv } from '../lib/result-csv';

const ROWS_PER_PAGE = 50;

function downloadCsv(result: QueryResult, fileName: string) {
  const csv = resultToCsv(
    result.columns.map((c) => c.name),
    result.rows,
  );
  const url = URL.createObjectURL(new Blob([csv], { type: 'text/csv;charset=utf-8' }));
  const link = document.createElement('a');
  link.href = url;
  link.download = fileName;
  link.click();
  URL.revokeObjectURL(url);
}

interface QueryResultsTableProps {
  result: QueryResult;
  elapsedMs: number;
  csvFileName: string;
}

/** The result in pages of 50 rows, with column types, row count, run time and a CSV download. */
export function QueryResultsTable({ result, elapsedMs, csvFileName }: QueryResultsTableProps) {
  const [page, setPage] = useState(0);
  const pageCount = Math.max(1, Math.ceil(result.rows.length / ROWS_PER_PAGE));
  const current = Math.min(page, pageCount - 1);
  const rows = result.rows.slice(current * ROWS_PER_PAGE, (current + 1) * ROWS_PER_PAGE);
  const first = result.rows.length ? current * ROWS_PER_PAGE + 1 : 0;

  return (
    <section aria-label="Query result" className="mt-3">
      <div className="flex flex-wrap items-center justify-between gap-2 text-sm text-ink-muted">
        <p aria-live="polite" className="tabular-nums">
          <span className="font-bold text-ink">{result.rows.length.toLocaleString('en')}</span>{' '}
          {result.rows.length === 1 ? 'row' : 'rows'} in{' '}
          <span className="font-bold text-ink">{elapsedMs.toFixed(0)}</span>{' '}
          <span className="font-normal">ms</span>
        </p>
        <div className="flex items-center gap-2">
          <Button size="sm" icon={Download} onClick={() => downloadCsv(result, csvFileName)}>
            Download CSV
          </Button>
          <span className="tabular-nums">
            {first}–{first ? first + rows.length - 1 : 0} of {result.rows.length}
          </span>
          <Button
            size="sm"
            icon={ChevronLeft}
            aria-label="Previous page of rows"
            title="Previous page of rows"
            disabled={current === 0}
            onClick={() => setPage(current - 1)}
          />
          <Button
            size="sm"
            icon={ChevronRight}
            aria-label="Next page of rows"
            title="Next page of rows"
            disabled={current >= pageCount - 1}
            onClick={() => setPage(current + 1)}
          />
        </div>
      </div>
      <div className="mt-2 max-h-[28rem] overflow-auto rounded-md border border-canvas-line">
        <table className="min-w-full text-left text-xs tabular-nums">
          <thead className="sticky top-0 bg-canvas-sunk">
            <tr>
              {result.columns.map((column, index) => (
                // biome-ignore lint/suspicious/noArrayIndexKey: column names may repeat in a result
                <th key={index} scope="col" className="px-2 py-1.5 align-bottom">
                  <span className="block font-bold text-ink">{column.name}</span>
                  <span className="block font-normal text-ink-muted">{column.type}</span>
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {rows.map((row, rowIndex) => (
              // biome-ignore lint/suspicious/noArrayIndexKey: a result row has no identity beyond its position
              <tr key={first + rowIndex} className="border-t border-canvas-line">
                {row.map((cell, columnIndex) => (
                  <td
                    // biome-ignore lint/suspicious/noArrayIndexKey: column names may repeat in a result
                    key={columnIndex}
                    className="max-w-[24rem] truncate px-2 py-1 font-mono text-ink"
                    title={formatCell(cell)}
                  >
                    {cell === null ? <span className="text-ink-faint">null</span> : formatCell(cell)}
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </section>
  );
}
