import { useEffect, useState } from 'react';
import { getBundleTable } from '../api/get-bundle-table';
import type { DuckDbSession } from '../lib/duckdb-engine';

export type SessionState =
  | { status: 'loading'; step: string }
  | { status: 'ready'; session: DuckDbSession }
  | { status: 'error'; error: unknown };

/**
 * Loads DuckDB-wasm (only now, not with the page) and the bundle's tables into it; closes the
 * worker when the console goes away.
 */
export function useDuckDbSession(bundleId: string, tables: readonly string[]): SessionState {
  const [state, setState] = useState<SessionState>({ status: 'loading', step: 'Starting DuckDB' });
  const tableKey = tables.join(',');

  useEffect(() => {
    const names = tableKey ? tableKey.split(',') : [];
    const abort = new AbortController();
    let session: DuckDbSession | undefined;
    let isCurrent = true;
    setState({ status: 'loading', step: 'Starting DuckDB' });
    (async () => {
      const [engine, ...bytes] = await Promise.all([
        import('../lib/duckdb-engine'),
        ...names.map((name) => getBundleTable(bundleId, name, abort.signal)),
      ]);
      if (!isCurrent) return;
      setState({ status: 'loading', step: `Loading ${names.length} tables` });
      session = await engine.openDuckDbSession(names.map((name, index) => ({ name, bytes: bytes[index] })));
      if (isCurrent) setState({ status: 'ready', session });
      else await session.close();
    })().catch((error: unknown) => {
      if (isCurrent) setState({ status: 'error', error });
    });
    return () => {
      isCurrent = false;
      abort.abort();
      void session?.close();
    };
  }, [bundleId, tableKey]);

  return state;
}
