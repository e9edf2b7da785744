import { useCallback, useState } from 'react';
import type { DuckDbSession } from '../lib/duckdb-engine';
import type { QueryResult } from '../lib/query-result';

export type RunState =
  | { status: 'idle' }
  | { status: 'running'; sql: string }
  | { status: 'done'; sql: string; result: QueryResult; elapsedMs: number }
  | { status: 'error'; sql: string; message: string };

/** Runs one query at a time and keeps its outcome; DuckDB's own error text is kept for display. */
export function useQueryRunner(session: DuckDbSession | undefined) {
  const [state, setState] = useState<RunState>({ status: 'idle' });

  const run = useCallback(
    async (sql: string) => {
      if (!session || !sql.trim()) return;
      setState({ status: 'running', sql });
      const started = performance.now();
      try {
        const result = await session.run(sql);
        setState({ status: 'done', sql, result, elapsedMs: performance.now() - started });
      } catch (error) {
        setState({ status: 'error', sql, message: error instanceof Error ? error.message : String(error) });
      }
    },
    [session],
  );

  return { state, run };
}
