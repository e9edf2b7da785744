import { type ChildProcess, spawn } from 'node:child_process';
import fs from 'node:fs';
import { createServer } from 'node:net';
import os from 'node:os';
import path from 'node:path';

const ROOT = path.join(import.meta.dirname, '..', '..');

function freePort(): Promise<number> {
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

/**
 * Starts one real Driftcase server (it builds the web app when its sources changed) on free ports
 * with a fresh data directory and the demo seed; `stop()` ends its process group and cleans up.
 */
export async function startWebServer(): Promise<{ baseUrl: string; stop: () => Promise<void> }> {
  const port = await freePort();
  const smtpPort = await freePort();
  const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'driftcase-bench-web-'));
  let log = '';
  const server: ChildProcess = spawn(path.join(ROOT, 'node_modules', '.bin', 'tsx'), ['api/src/server.ts'], {
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
  const keep = (chunk: Buffer) => {
    log = (log + chunk.toString()).slice(-10_000);
  };
  server.stdout?.on('data', keep);
  server.stderr?.on('data', keep);
  const stop = async () => {
    if (server.exitCode === null && server.pid) {
      const exited = new Promise((resolve) => server.once('exit', resolve));
      process.kill(-server.pid, 'SIGTERM');
      await Promise.race([exited, new Promise((resolve) => setTimeout(resolve, 5000))]);
      if (server.exitCode === null) process.kill(-server.pid, 'SIGKILL');
    }
    fs.rmSync(dataDir, { recursive: true, force: true });
  };
  const baseUrl = `http://127.0.0.1:${port}`;
  const deadline = Date.now() + 180_000;
  while (Date.now() < deadline) {
    if (server.exitCode !== null) {
      await stop();
      throw new Error(`the server exited with code ${server.exitCode}:\n${log}`);
    }
    const ok = await fetch(`${baseUrl}/api/health`).then(
      (r) => r.ok,
      () => false,
    );
    if (ok) return { baseUrl, stop };
    await new Promise((resolve) => setTimeout(resolve, 250));
  }
  await stop();
  throw new Error(`the server did not answer within 180 s:\n${log}`);
}
