import { type ChildProcess, spawn } from 'node:child_process';
import fs from 'node:fs';
import { createServer } from 'node:net';
import os from 'node:os';
import path from 'node:path';

const ROOT = path.join(import.meta.dirname, '..', '..');

export function findFreePort(): Promise<number> {
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

export interface StartedServer {
  baseUrl: string;
  stop: () => Promise<void>;
}

/**
 * Starts one real Driftcase server (`tsx api/src/server.ts`, which builds the web app when its
 * sources changed) on free ports with a fresh data directory and the demo seed, and waits for
 * `/api/health`. `stop()` ends its whole process group and removes the data directory. Used by the
 * browser tests and the browser benchmarks.
 */
export async function startServer(
  options: { label: string; logFile?: string; timeoutMs?: number; env?: Record<string, string> } = {
    label: 'server',
  },
): Promise<StartedServer> {
  const port = await findFreePort();
  // The fake SMTP server gets its own free port too, so parallel runs on one machine do not clash.
  const smtpPort = await findFreePort();
  const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), `driftcase-${options.label}-`));
  const baseUrl = `http://127.0.0.1:${port}`;
  let output = '';
  const server: ChildProcess = spawn(path.join(ROOT, 'node_modules', '.bin', 'tsx'), ['api/src/server.ts'], {
    cwd: ROOT,
    env: {
      ...process.env,
      PORT: String(port),
      DATA_DIR: dataDir,
      DEMO_SEED: '1',
      SMTP_FAKE_PORT: String(smtpPort),
      LOG_LEVEL: 'warn',
      ...options.env,
    },
    stdio: ['ignore', 'pipe', 'pipe'],
    detached: true,
  });
  if (options.logFile) {
    fs.mkdirSync(path.dirname(options.logFile), { recursive: true });
    fs.writeFileSync(options.logFile, '');
  }
  const keep = (chunk: Buffer) => {
    output = (output + chunk.toString()).slice(-20_000);
    if (options.logFile) fs.appendFileSync(options.logFile, chunk);
  };
  server.stdout?.on('data', keep);
  server.stderr?.on('data', keep);
  server.once('exit', (code, signal) => {
    if (options.logFile)
      fs.appendFileSync(
        options.logFile,
        `\n[${options.label}] server exited: code ${code}, signal ${signal}\n`,
      );
  });

  const stop = async () => {
    if (server.exitCode === null && server.pid) {
      const exited = new Promise((resolve) => server.once('exit', resolve));
      // The negative pid signals tsx's whole process group, so no node child outlives the run.
      process.kill(-server.pid, 'SIGTERM');
      await Promise.race([exited, new Promise((resolve) => setTimeout(resolve, 5_000))]);
      if (server.exitCode === null) process.kill(-server.pid, 'SIGKILL');
    }
    fs.rmSync(dataDir, { recursive: true, force: true });
  };

  const timeoutMs = options.timeoutMs ?? 180_000;
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    if (server.exitCode !== null) {
      await stop();
      throw new Error(
        `${options.label}: the server exited with code ${server.exitCode} before it was healthy:\n${output}`,
      );
    }
    const isHealthy = await fetch(`${baseUrl}/api/health`).then(
      (response) => response.ok,
      () => false,
    );
    if (isHealthy) return { baseUrl, stop };
    await new Promise((resolve) => setTimeout(resolve, 250));
  }
  await stop();
  throw new Error(
    `${options.label}: ${baseUrl}/api/health did not answer within ${timeoutMs / 1000} s:\n${output}`,
  );
}
