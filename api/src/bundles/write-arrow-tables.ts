import { mkdir, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import type { Bundle } from '@shared/bundle/types';
import { tableToIPC } from 'apache-arrow';
import { bundleToArrowTables } from './bundle-arrow-tables';

export interface WrittenArrowTable {
  /** Table name = bundle file stem (`odometry`, `scans`, ...). */
  name: string;
  /** Absolute or `outDir`-relative path of the `.arrow` file written. */
  file: string;
  rows: number;
}

/**
 * Writes each table of a parsed bundle as an Apache Arrow IPC stream file `<name>.arrow` in
 * `outDir`. Stream (not file) format because DuckDB-wasm ingests it with insertArrowFromIPCStream.
 * These are derived copies; the original bundle remains the evidence.
 */
export async function writeArrowTables(bundle: Bundle, outDir: string): Promise<WrittenArrowTable[]> {
  await mkdir(outDir, { recursive: true });
  const written: WrittenArrowTable[] = [];
  for (const [name, table] of bundleToArrowTables(bundle)) {
    const file = join(outDir, `${name}.arrow`);
    await writeFile(file, tableToIPC(table, 'stream'));
    written.push({ name, file, rows: table.numRows });
  }
  return written;
}
