import { execFile } from 'node:child_process';
import { promisify } from 'node:util';

/** Runs `npm run cli -- verify-archive ARGS` as a third party would; its exit code and output. */
export async function runVerifyArchive(...args: string[]): Promise<{ code: number; stdout: string }> {
  try {
    const { stdout } = await promisify(execFile)(
      'npx',
      ['tsx', 'api/src/cli/main.ts', 'verify-archive', ...args],
      {
        timeout: 180_000,
      },
    );
    return { code: 0, stdout };
  } catch (error) {
    const failed = error as { code: number; stdout: string };
    return { code: failed.code, stdout: failed.stdout };
  }
}
