/**
 * Driftcase command line: `npm run cli -- <command> [args]`.
 * Exit codes: 0 success, 2 invalid input (bad bundle, bad option, failed verification), 1 internal failure;
 * verify-archive also exits 3 when nothing failed but something is unconfirmed (signatures not anchored
 * to a trusted key, or replay digests from an older engine).
 * Each command lives in its own module under ./commands and is loaded only when asked for.
 */
import { installPlainWords } from '../../../shared/contracts/plain-words';

type CommandModule = { run(args: string[]): Promise<number> };

const COMMANDS: Record<string, { summary: string; load: () => Promise<CommandModule> }> = {
  check: {
    summary: 'check PATH [--json]            validate an incident bundle (.zip or folder)',
    load: () => import('./commands/check'),
  },
  import: {
    summary:
      'import SOURCE [options] --out BUNDLE.zip  read a robot recording (.mcap, .bag, .db3, rosbag2 folder) into a bundle',
    load: () => import('./commands/import'),
  },
  replay: {
    summary: 'replay PATH [options]          re-run the particle filter over a bundle',
    load: () => import('./commands/replay'),
  },
  'verify-archive': {
    summary:
      'verify-archive FILE.zip [--trusted-keys JWKS.json] [--trusted-thumbprint T]  check an evidence archive offline (exit 0 ok, 3 not anchored / older digests, 2 failed)',
    load: () => import('./commands/verify-archive'),
  },
};

function printUsage(): void {
  process.stdout.write('Usage: npm run cli -- <command> [args]\n\nCommands:\n');
  for (const { summary } of Object.values(COMMANDS)) process.stdout.write(`  ${summary}\n`);
}

async function main(argv: string[]): Promise<number> {
  installPlainWords(); // the same sentences as the API and the web app
  const [name, ...rest] = argv;
  if (!name || name === '--help' || name === '-h') {
    printUsage();
    return name ? 0 : 2;
  }
  const command = COMMANDS[name];
  if (!command) {
    process.stderr.write(`Unknown command "${name}".\n`);
    printUsage();
    return 2;
  }
  const module = await command.load();
  return module.run(rest);
}

main(process.argv.slice(2)).then(
  (code) => {
    process.exitCode = code;
  },
  (error: unknown) => {
    process.stderr.write(`Internal failure: ${error instanceof Error ? error.message : String(error)}\n`);
    process.exitCode = 1;
  },
);
