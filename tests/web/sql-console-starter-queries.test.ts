import { createRequire } from 'node:module';
import path from 'node:path';
import { createDuckDB, type DuckDBBindings, NODE_RUNTIME, VoidLogger } from '@duckdb/duckdb-wasm/blocking';
import type { Bundle } from '@shared/bundle/types';
import { queryResultSha256 } from '@shared/query-result-hash';
import { readQueryResult } from '@web/features/sql-console/lib/query-result';
import { startersFor } from '@web/features/sql-console/lib/starter-queries';
import { tableToIPC } from 'apache-arrow';
import { beforeAll, describe, expect, it } from 'vitest';
import { bundleToArrowTables } from '../../api/src/bundles/bundle-arrow-tables';
import { inspectBundle } from '../../api/src/bundles/inspect-bundle';

/**
 * Runs each starter query with DuckDB-wasm (the Node build of the same engine the browser uses) on
 * a sample bundle's tables, passed as Arrow IPC bytes as in the browser, and checks the answers
 * against values computed directly from the parsed bundle columns.
 */
const require = createRequire(import.meta.url);
const DIST = path.dirname(require.resolve('@duckdb/duckdb-wasm/dist/duckdb-eh.wasm'));

let bundle: Bundle;
let db: DuckDBBindings;
let connection: ReturnType<DuckDBBindings['connect']>;
let tableNames: string[];

function run(sql: string) {
  // biome-ignore lint/correctness/useHookAtTopLevel: DuckDB's connection method, not a React hook
  return readQueryResult(connection.useUnsafe((bindings, id) => bindings.runQuery(id, sql)));
}

function starter(id: string): string {
  const found = startersFor(tableNames).find((s) => s.id === id);
  if (!found) throw new Error(`no starter ${id} for tables ${tableNames.join(', ')}`);
  return found.sql;
}

function column(result: ReturnType<typeof run>, name: string) {
  const index = result.columns.findIndex((c) => c.name === name);
  return result.rows.map((row) => row[index]);
}

beforeAll(async () => {
  const inspection = await inspectBundle({ kind: 'folder', path: path.resolve('sample-logs/wheel-slip') });
  if (!inspection.bundle) throw new Error(JSON.stringify(inspection.issues.slice(0, 3)));
  bundle = inspection.bundle;
  db = await createDuckDB(
    {
      mvp: {
        mainModule: path.join(DIST, 'duckdb-mvp.wasm'),
        mainWorker: path.join(DIST, 'duckdb-node-mvp.worker.cjs'),
      },
      eh: {
        mainModule: path.join(DIST, 'duckdb-eh.wasm'),
        mainWorker: path.join(DIST, 'duckdb-node-eh.worker.cjs'),
      },
    },
    new VoidLogger(),
    NODE_RUNTIME,
  );
  await db.instantiate(() => {});
  db.open({ query: { castDecimalToDouble: true, castBigIntToDouble: false } });
  connection = db.connect();
  const tables = bundleToArrowTables(bundle);
  tableNames = [...tables.keys()];
  for (const [name, table] of tables)
    connection.insertArrowFromIPCStream(tableToIPC(table, 'stream'), { name, create: true });
});

describe('starter queries on the wheel-slip sample', () => {
  it('offers every starter when all tables are present', () => {
    expect(startersFor(tableNames).map((s) => s.id)).toEqual([
      'odometry-jumps',
      'time-gaps',
      'events-near-incident',
      'detections-per-class',
      'scans-missing-returns',
    ]);
    expect(startersFor(['odometry']).map((s) => s.id)).toEqual(['odometry-jumps', 'time-gaps']);
  });

  it('finds the largest odometry jump that a direct scan of the columns finds', () => {
    const { x, y } = bundle.odometry;
    let largest = 0;
    for (let k = 1; k < x.length; k++)
      largest = Math.max(largest, Math.hypot(x[k] - x[k - 1], y[k] - y[k - 1]));
    const result = run(starter('odometry-jumps'));
    expect(result.rows).toHaveLength(Math.min(20, x.length - 1));
    expect(column(result, 'jump_m')[0]).toBeCloseTo(largest, 4);
  });

  it('reports the largest time gap of the odometry stream', () => {
    const { t } = bundle.odometry;
    let largest = 0;
    for (let k = 1; k < t.length; k++) largest = Math.max(largest, t[k] - t[k - 1]);
    const result = run(starter('time-gaps'));
    const odometry = result.rows[column(result, 'stream').indexOf('odometry')];
    const maxIndex = result.columns.findIndex((c) => c.name === 'max_gap_s');
    expect(odometry[maxIndex]).toBeCloseTo(largest, 4);
    // count(*) is a 64-bit integer in DuckDB: it arrives as BigInt and is kept exact as text.
    const intervals = odometry[result.columns.findIndex((c) => c.name === 'intervals')];
    expect(intervals).toBe(String(t.length - 1));
  });

  it('lists events within 5 s of the first contact or protective stop', () => {
    const events = bundle.events;
    if (!events) throw new Error('the sample has events');
    const incident = Math.min(
      ...events.t.filter((_, k) => events.kind[k] === 'contact' || events.kind[k] === 'protective_stop'),
    );
    expect(Number.isFinite(incident)).toBe(true);
    const expected = events.t.filter((t) => Math.abs(t - incident) <= 5).length;
    const result = run(starter('events-near-incident'));
    expect(result.rows).toHaveLength(expected);
    for (const offset of column(result, 'offset_s'))
      expect(Math.abs(offset as number)).toBeLessThanOrEqual(5);
  });

  it('counts detections per class as the parsed columns do', () => {
    const detections = bundle.detections;
    const classes = bundle.manifest.detector?.classes ?? [];
    if (!detections) throw new Error('the sample has detections');
    const counts = new Map<string, number>();
    for (const index of detections.classIndex)
      counts.set(classes[index], (counts.get(classes[index]) ?? 0) + 1);
    const result = run(starter('detections-per-class'));
    const got = new Map(result.rows.map((row) => [row[0] as string, Number(row[1])]));
    expect(got).toEqual(counts);
  });

  it('finds the scan with the most missing returns', () => {
    const scans = bundle.scans;
    if (!scans) throw new Error('the sample has scans');
    let most = 0;
    for (let s = 0; s < scans.count; s++) {
      let missing = 0;
      for (let b = 0; b < scans.beams; b++) if (Number.isNaN(scans.ranges[s * scans.beams + b])) missing++;
      most = Math.max(most, missing);
    }
    const result = run(starter('scans-missing-returns'));
    expect(Number(column(result, 'missing_returns')[0])).toBe(most);
  });

  it('reads lists, nulls and 64-bit integers into the canonical cells that are hashed', () => {
    const result = run(
      'SELECT 3::BIGINT AS n, NULL AS nothing, [1.5, NULL]::FLOAT[] AS list, 0.1::FLOAT AS f',
    );
    expect(result.columns.map((c) => c.name)).toEqual(['n', 'nothing', 'list', 'f']);
    // 0.1 as an IEEE 754 binary32 value widened to a double (IEEE 754-2008 rounding).
    expect(result.rows).toEqual([['3', null, [1.5, null], 0.10000000149011612]]);
    expect(queryResultSha256(['n', 'nothing', 'list', 'f'], result.rows)).toMatch(/^[0-9a-f]{64}$/);
  });

  it('passes DuckDB errors through with its own message', () => {
    expect(() => run('SELECT no_such_column FROM odometry')).toThrow(/no_such_column/);
  });
});
