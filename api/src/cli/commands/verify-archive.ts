import { stat } from 'node:fs/promises';
import { formatCheckLine, verifyArchive } from '../../archive/verify-archive';

const USAGE = 'Usage: npm run cli -- verify-archive FILE.zip [--json] [--skip-replays]\n';
const OPTIONS = new Set(['--json', '--skip-replays']);

/**
 * `verify-archive FILE.zip`: checks an evidence archive offline (no database). Prints one line per
 * check; exit 0 when every check holds, 3 when everything holds except replay digests recorded
 * under an older digest layout (not comparable, not tampering), 2 when any check fails or the
 * usage is wrong, 1 on internal failure.
 */
export async function run(args: string[]): Promise<number> {
  const unknown = args.filter((arg) => arg.startsWith('-') && !OPTIONS.has(arg));
  const files = args.filter((arg) => !arg.startsWith('-'));
  if (unknown.length > 0 || files.length !== 1) {
    process.stderr.write(
      `${unknown.length ? `Unknown option ${unknown[0]}.` : 'Give exactly one FILE.zip.'}\n${USAGE}`,
    );
    return 2;
  }
  const file = files[0];
  if (!(await stat(file).catch(() => undefined))?.isFile()) {
    process.stderr.write(`${file}: no such file\n`);
    return 2;
  }
  try {
    const result = await verifyArchive(file, { skipReplays: args.includes('--skip-replays') });
    if (args.includes('--json')) process.stdout.write(`${JSON.stringify(result, null, 2)}\n`);
    else {
      process.stdout.write(`Archive ${file}\nSHA-256 ${result.archiveSha256}\n`);
      for (const check of result.checks) process.stdout.write(`${formatCheckLine(check)}\n`);
      const failed = result.checks.filter((c) => !c.ok && c.olderDigestLayout === undefined).length;
      const older = result.checks.filter((c) => c.olderDigestLayout !== undefined).length;
      process.stdout.write(
        result.ok
          ? `ALL ${result.checks.length} CHECKS PASSED\n`
          : failed > 0
            ? `${failed} OF ${result.checks.length} CHECKS FAILED${older ? ` (and ${older} replay digest${older === 1 ? '' : 's'} from an older engine not comparable)` : ''}\n`
            : `ALL ${result.checks.length - older} OTHER CHECKS PASSED; ${older} REPLAY DIGEST${older === 1 ? '' : 'S'} FROM AN OLDER ENGINE COULD NOT BE RE-CONFIRMED (not tampering; see the OLD lines)\n`,
      );
    }
    if (result.ok) return 0;
    return result.checks.every((c) => c.ok || c.olderDigestLayout !== undefined) ? 3 : 2;
  } catch (error) {
    process.stderr.write(`Internal failure while verifying ${file}: ${(error as Error).message}\n`);
    return 1;
  }
}
