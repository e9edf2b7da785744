import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import type { TestProject } from 'vitest/node';
import { startServer } from '../support/start-server';

declare module 'vitest' {
  export interface ProvidedContext {
    /** Where the Driftcase server under test listens, e.g. `http://127.0.0.1:41234`. */
    baseUrl: string;
    /** The server's SITE_TIME_ZONE: every screen, mail and report shows times in it. */
    siteTimeZone: string;
  }
}

const ROOT = fileURLToPath(new URL('../..', import.meta.url));
const BUILT_INDEX = path.join(ROOT, 'dist', 'web', 'index.html');

function newestMtime(target: string): number {
  const stat = fs.statSync(target, { throwIfNoEntry: false });
  if (!stat) return 0;
  if (!stat.isDirectory()) return stat.mtimeMs;
  return fs
    .readdirSync(target)
    .reduce((newest, entry) => Math.max(newest, newestMtime(path.join(target, entry))), stat.mtimeMs);
}

/** Builds the web app when there is no build or the web sources are newer than it. */
function buildWebIfNeeded() {
  const builtAt = fs.statSync(BUILT_INDEX, { throwIfNoEntry: false })?.mtimeMs ?? 0;
  const sourcesAt = Math.max(newestMtime(path.join(ROOT, 'web')), newestMtime(path.join(ROOT, 'shared')));
  if (builtAt > sourcesAt) return;
  const result = spawnSync(path.join(ROOT, 'node_modules', '.bin', 'vite'), ['build', '--logLevel', 'warn'], {
    cwd: ROOT,
    stdio: 'inherit',
  });
  if (result.status !== 0) throw new Error('e2e setup: `vite build` failed; see its output above.');
}

/**
 * The site's zone for the browser tests: Berlin, while each test's browser runs in another zone
 * (UTC unless it says otherwise), so a time shown in the browser's own zone would be caught.
 */
export const E2E_SITE_TIME_ZONE = 'Europe/Berlin';

/** Starts one real server (fresh data directory, demo seed, fake SMTP) for all browser tests. */
export default async function setup(project: TestProject) {
  buildWebIfNeeded();
  // The whole server log is kept on disk, so a crash in the middle of a run can be diagnosed.
  const server = await startServer({
    label: 'e2e',
    logFile: path.join(ROOT, 'tests', 'output', 'e2e-server.log'),
    env: { SITE_TIME_ZONE: E2E_SITE_TIME_ZONE },
  });
  project.provide('baseUrl', server.baseUrl);
  project.provide('siteTimeZone', E2E_SITE_TIME_ZONE);
  return server.stop;
}
