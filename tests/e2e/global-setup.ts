import { type ChildProcess, spawn, spawnSync } from 'node:child_process';
import fs from 'node:fs';
import { createServer } from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import type { TestProject } from 'vitest/node';

declare module 'vitest' {
  export interface ProvidedContext {
    /** Where the Driftcase server under test listens, e.g. `http://127.0.0.1:41234`. */
    baseUrl: string;
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

function findFreePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const probe = createServer();
    probe.once('error', reject);
    probe.listen(0, '127.0.0.1', () => {
      const address = probe.address();
      probe.close(() =>
        typeof address === 'object' && address ? resolve(address.port) : reject(new Error('no port')),
      );
    });
  });
}

async function waitForHealth(baseUrl: string, server: ChildProcess, log: () => string, timeoutMs = 120_000) {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    if (server.exitCode !== null) {
      throw new Error(
        `e2e setup: the server exited with code ${server.exitCode} before it was healthy:\n${log()}`,
      );
    }
    try {
      const response = await fetch(`${baseUrl}/api/health`);
      if (response.ok) return;
    } catch {
      // Not listening yet.
    }
    await new Promise((resolve) => setTimeout(resolve, 250));
  }
  throw new Error(`e2e setup: ${baseUrl}/api/health did not answer within ${timeoutMs / 1000} s:\n${log()}`);
}

/** Starts one real server (fresh data directory, demo seed, fake SMTP) for all browser tests. */
export default async function setup(project: TestProject) {
  buildWebIfNeeded();
  const port = await findFreePort();
  // The fake SMTP server gets its own free port too, so parallel runs on one machine do not clash.
  const smtpPort = await findFreePort();
  const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'driftcase-e2e-'));
  const baseUrl = `http://127.0.0.1:${port}`;
  let output = '';
  const server = spawn(path.join(ROOT, 'node_modules', '.bin', 'tsx'), ['api/src/server.ts'], {
    cwd: ROOT,
    env: {
      ...process.env,
      PORT: String(port),
      DATA_DIR: dataDir,
      DEMO_SEED: '1',
      SMTP_FAKE_PORT: String(smtpPort),
      LOG_LEVEL: 'warn',
    },
    stdio: ['ignore', 'pipe', 'pipe'],
    detached: true,
  });
  // The whole server log is kept on disk, so a crash in the middle of a run can be diagnosed.
  const logFile = path.join(ROOT, 'tests', 'output', 'e2e-server.log');
  fs.mkdirSync(path.dirname(logFile), { recursive: true });
  fs.writeFileSync(logFile, '');
  const keep = (chunk: Buffer) => {
    output = (output + chunk.toString()).slice(-20_000);
    fs.appendFileSync(logFile, chunk);
  };
  server.stdout?.on('data', keep);
  server.stderr?.on('data', keep);

  server.once('exit', (code, signal) => {
    fs.appendFileSync(logFile, `\n[e2e setup] server exited: code ${code}, signal ${signal}\n`);
  });

  const stop = async () => {
    if (server.exitCode === null && server.pid) {
      const exited = new Promise((resolve) => server.once('exit', resolve));
      // The negative pid signals tsx's whole process group, so no node child outlives the tests.
      process.kill(-server.pid, 'SIGTERM');
      await Promise.race([exited, new Promise((resolve) => setTimeout(resolve, 5_000))]);
      if (server.exitCode === null) process.kill(-server.pid, 'SIGKILL');
    }
    fs.rmSync(dataDir, { recursive: true, force: true });
  };

  try {
    await waitForHealth(baseUrl, server, () => output);
  } catch (error) {
    await stop();
    throw error;
  }
  project.provide('baseUrl', baseUrl);
  return stop;
}
