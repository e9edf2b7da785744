import * as duckdb from '@duckdb/duckdb-wasm';
import ehWorker from '@duckdb/duckdb-wasm/dist/duckdb-browser-eh.worker.js?url';
import mvpWorker from '@duckdb/duckdb-wasm/dist/duckdb-browser-mvp.worker.js?url';
import ehWasm from '@duckdb/duckdb-wasm/dist/duckdb-eh.wasm?url';
import mvpWasm from '@duckdb/duckdb-wasm/dist/duckdb-mvp.wasm?url';
import { type QueryResult, readQueryResult } from './query-result';

/** One DuckDB connection in a worker, fed the bundle's tables as Arrow IPC bytes. */
export interface DuckDbSession {
  /**
   * Runs SQL. DuckDB answers with Arrow IPC bytes, decoded with this app's Arrow: passing Arrow
   * objects between DuckDB's bundled Arrow and ours silently loses data.
   */
  run(sql: string): Promise<QueryResult>;
  close(): Promise<void>;
}

const BUNDLES: duckdb.DuckDBBundles = {
  mvp: { mainModule: mvpWasm, mainWorker: mvpWorker },
  eh: { mainModule: ehWasm, mainWorker: ehWorker },
};

/**
 * Starts DuckDB-wasm and loads each table under its own name. This module is imported
 * dynamically, so the 35-40 MB of WebAssembly is fetched only when a console opens.
 */
export async function openDuckDbSession(
  tables: { name: string; bytes: Uint8Array }[],
): Promise<DuckDbSession> {
  const bundle = await duckdb.selectBundle(BUNDLES);
  const worker = new Worker(bundle.mainWorker as string);
  const db = new duckdb.AsyncDuckDB(new duckdb.VoidLogger(), worker);
  try {
    await db.instantiate(bundle.mainModule, bundle.pthreadWorker);
    // Decimals become doubles so sums and averages read as numbers; 64-bit integers stay exact (BigInt).
    await db.open({ query: { castDecimalToDouble: true, castBigIntToDouble: false } });
    const connection = await db.connect();
    for (const table of tables) {
      await connection.insertArrowFromIPCStream(table.bytes, { name: table.name, create: true });
    }
    return {
      run: async (sql) =>
        readQueryResult(await connection.useUnsafe((bindings, id) => bindings.runQuery(id, sql))),
      close: async () => {
        await connection.close();
        await db.terminate();
      },
    };
  } catch (error) {
    await db.terminate();
    throw error;
  }
}
