// Browser tests need Debian's Chromium. Install it when we can (root with apt-get); otherwise stop with
// instructions. Browser tests must never be skipped silently.
import { execFileSync, spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';

const CHROMIUM = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';

function hasCommand(name) {
  return spawnSync('sh', ['-c', `command -v ${name}`], { stdio: 'ignore' }).status === 0;
}

if (existsSync(CHROMIUM)) process.exit(0);

const isRoot = typeof process.getuid === 'function' && process.getuid() === 0;
if (isRoot && hasCommand('apt-get')) {
  console.log(
    `ensure-chromium: ${CHROMIUM} is missing; installing Debian's chromium with apt-get (about 20 s)...`,
  );
  try {
    execFileSync('apt-get', ['update'], { stdio: 'inherit' });
    execFileSync('apt-get', ['install', '-y', 'chromium'], {
      stdio: 'inherit',
      env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' },
    });
  } catch {
    console.error('ensure-chromium: apt-get could not install chromium; see the messages above.');
    process.exit(1);
  }
  if (existsSync(CHROMIUM)) process.exit(0);
  console.error(`ensure-chromium: apt-get finished but ${CHROMIUM} still does not exist.`);
  process.exit(1);
}

console.error(
  [
    `ensure-chromium: the browser tests need Chromium at ${CHROMIUM}, and it is missing.`,
    'Install it, then run the tests again:',
    '  Debian/Ubuntu:  sudo apt-get update && sudo apt-get install -y chromium',
    'Or point CHROMIUM_PATH at an existing Chromium or Chrome binary.',
  ].join('\n'),
);
process.exit(1);
