/**
 * Runs every `bench/*.ts` module that exports `run()` (one after another, never in parallel: the
 * machine is shared) and prints each figure it returns as one JSON line.
 */
import { readdirSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';

type BenchModule = { run?: () => Promise<unknown> };

async function main(): Promise<void> {
  const folder = dirname(fileURLToPath(import.meta.url));
  const only = process.argv[2];
  const files = readdirSync(folder)
    .filter((name) => name.endsWith('.ts') && name !== 'run-all.ts' && !name.endsWith('.d.ts'))
    .filter((name) => !only || name.includes(only))
    .sort();
  for (const file of files) {
    const module = (await import(pathToFileURL(join(folder, file)).href)) as BenchModule;
    if (typeof module.run !== 'function') continue;
    const figures = await module.run();
    for (const figure of Array.isArray(figures) ? figures : [figures]) {
      process.stdout.write(`${JSON.stringify({ bench: file, ...(figure as object) })}\n`);
    }
  }
}

main().catch((error: unknown) => {
  process.stderr.write(`benchmark failed: ${error instanceof Error ? error.message : String(error)}\n`);
  process.exitCode = 1;
});
