import fs from 'node:fs';
import path from 'node:path';
import type { Logger } from 'pino';
import { PROJECT_ROOT } from './config';

export const WEB_DIST = path.join(PROJECT_ROOT, 'dist', 'web');
const SOURCES = ['web', 'shared', 'vite.config.ts', 'tailwind.config.ts', 'package-lock.json'];

function newestMtime(target: string): number {
  const stat = fs.statSync(target, { throwIfNoEntry: false });
  if (!stat) return 0;
  if (!stat.isDirectory()) return stat.mtimeMs;
  let newest = stat.mtimeMs;
  for (const entry of fs.readdirSync(target))
    newest = Math.max(newest, newestMtime(path.join(target, entry)));
  return newest;
}

/** True when there is no build yet or a web source changed after the last one. */
export function isWebBuildStale(): boolean {
  const built = fs.statSync(path.join(WEB_DIST, 'index.html'), { throwIfNoEntry: false });
  if (!built) return true;
  return SOURCES.some((source) => newestMtime(path.join(PROJECT_ROOT, source)) > built.mtimeMs);
}

/** Builds the web app with Vite when it is missing or stale, so `npm start` is one step. */
export async function ensureWebBuild(logger: Logger): Promise<void> {
  if (!isWebBuildStale()) return;
  logger.info('building the web app (first start or sources changed)');
  const { build } = await import('vite');
  await build({ configFile: path.join(PROJECT_ROOT, 'vite.config.ts'), logLevel: 'warn' });
}
