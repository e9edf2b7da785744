import { readFile, stat } from 'node:fs/promises';
import { parseArgs } from 'node:util';
import type { JSONWebKeySet } from 'jose';
import type { TArchiveVerification } from '../../../../shared/contracts/archives';
import type { TrustAnchor } from '../../archive/trust-anchor';
import { formatCheckLine, verificationOutcome, verifyArchive } from '../../archive/verify-archive';

const USAGE = `Usage: npm run cli -- verify-archive FILE.zip [--trusted-keys JWKS.json] [--trusted-thumbprint T]... [--checkpoints FILE] [--json] [--skip-replays]

  --trusted-keys JWKS.json   public keys you trust (e.g. your site's copy of GET /api/keys)
  --trusted-thumbprint T     RFC 7638 thumbprint your site publishes; a key in the archive with it is trusted
  --checkpoints FILE         signed audit checkpoints kept outside Driftcase (DATA_DIR/audit/checkpoints.jsonl
                             or the lines mailed to legal); the archived chain must agree with them
  --json                     print the checks as JSON
  --skip-replays             do not re-run replays (digests not checked)

Exit codes: 0 every check held against a trusted key; 3 nothing failed but something is not
confirmed (no trusted key given, so signatures are not anchored; or a replay digest from an older
engine); 2 a check failed or the usage is wrong; 1 internal failure.
`;

async function readTrustedKeys(file: string): Promise<JSONWebKeySet['keys']> {
  let parsed: unknown;
  try {
    parsed = JSON.parse(await readFile(file, 'utf8'));
  } catch (error) {
    throw new UsageError(`--trusted-keys ${file}: cannot be read as JSON (${(error as Error).message})`);
  }
  const keys = (parsed as { keys?: unknown })?.keys;
  if (!Array.isArray(keys) || keys.length === 0)
    throw new UsageError(
      `--trusted-keys ${file}: not a JWK set (expected {"keys": [ ... ]} with at least one key)`,
    );
  return keys as JSONWebKeySet['keys'];
}

class UsageError extends Error {}

async function parseTrust(
  keysFile: string | undefined,
  thumbprints: string[],
): Promise<TrustAnchor | undefined> {
  if (!keysFile && thumbprints.length === 0) return undefined;
  for (const thumbprint of thumbprints)
    if (!/^[A-Za-z0-9_-]{43}$/.test(thumbprint))
      throw new UsageError(
        `--trusted-thumbprint ${thumbprint}: not an RFC 7638 SHA-256 thumbprint (43 base64url characters)`,
      );
  const labels = [
    keysFile && `--trusted-keys ${keysFile}`,
    ...thumbprints.map((t) => `--trusted-thumbprint ${t}`),
  ];
  return {
    keys: keysFile ? await readTrustedKeys(keysFile) : [],
    thumbprints,
    label: labels.filter(Boolean).join(' and '),
  };
}

function summaryLine(result: TArchiveVerification, outcome: 0 | 2 | 3): string {
  const total = result.checks.length;
  const failed = result.checks.filter(
    (c) => !c.ok && c.olderDigestLayout === undefined && !c.unanchored,
  ).length;
  const older = result.checks.filter((c) => c.olderDigestLayout !== undefined).length;
  const olderNote = older
    ? `${older} REPLAY DIGEST${older === 1 ? '' : 'S'} FROM AN OLDER ENGINE COULD NOT BE RE-CONFIRMED (not tampering; see the OLD lines)`
    : '';
  if (outcome === 0) return `ALL ${total} CHECKS PASSED (signatures verified against trusted keys)`;
  if (outcome === 2)
    return `${failed} OF ${total} CHECKS FAILED${older ? ` (and ${olderNote.toLowerCase()})` : ''}`;
  const unconfirmed = result.checks.filter((c) => !c.ok).length;
  const notes = [
    !result.signaturesAnchored &&
      'SIGNATURES NOT ANCHORED: no trusted key was given, so nothing shows who signed this archive (see the WARN lines; verify again with --trusted-keys or --trusted-thumbprint)',
    olderNote,
  ].filter(Boolean);
  if (result.signaturesAnchored && unconfirmed === older) return `ALL OTHER CHECKS PASSED; ${olderNote}`;
  return `NO CHECK FAILED, BUT ${unconfirmed} OF ${total} ARE NOT CONFIRMED. ${notes.join('; ')}`;
}

/**
 * `verify-archive FILE.zip`: checks an evidence archive offline (no database). Prints one line per
 * check and a summary; see USAGE for the exit codes.
 */
export async function run(args: string[]): Promise<number> {
  let parsed: ReturnType<typeof parseCommandLine>;
  try {
    parsed = parseCommandLine(args);
  } catch (error) {
    process.stderr.write(`${(error as Error).message}\n${USAGE}`);
    return 2;
  }
  const { values, positionals } = parsed;
  if (positionals.length !== 1) {
    process.stderr.write(`Give exactly one FILE.zip.\n${USAGE}`);
    return 2;
  }
  const file = positionals[0];
  if (!(await stat(file).catch(() => undefined))?.isFile()) {
    process.stderr.write(`${file}: no such file\n`);
    return 2;
  }
  let trust: TrustAnchor | undefined;
  try {
    trust = await parseTrust(values['trusted-keys'], values['trusted-thumbprint'] ?? []);
  } catch (error) {
    if (!(error instanceof UsageError)) throw error;
    process.stderr.write(`${error.message}\n`);
    return 2;
  }
  try {
    const checkpointsFile = values.checkpoints;
    const checkpoints = checkpointsFile
      ? {
          lines: (await readFile(checkpointsFile, 'utf8')).split('\n'),
          label: `--checkpoints ${checkpointsFile}`,
        }
      : undefined;
    const result = await verifyArchive(file, { skipReplays: values['skip-replays'], trust, checkpoints });
    const outcome = verificationOutcome(result);
    if (values.json) process.stdout.write(`${JSON.stringify(result, null, 2)}\n`);
    else {
      process.stdout.write(`Archive ${file}\nSHA-256 ${result.archiveSha256}\n`);
      for (const check of result.checks) process.stdout.write(`${formatCheckLine(check)}\n`);
      process.stdout.write(`${summaryLine(result, outcome)}\n`);
    }
    return outcome;
  } catch (error) {
    process.stderr.write(`Internal failure while verifying ${file}: ${(error as Error).message}\n`);
    return 1;
  }
}

function parseCommandLine(args: string[]) {
  return parseArgs({
    args,
    allowPositionals: true,
    strict: true,
    options: {
      json: { type: 'boolean' },
      'skip-replays': { type: 'boolean' },
      'trusted-keys': { type: 'string' },
      'trusted-thumbprint': { type: 'string', multiple: true },
      checkpoints: { type: 'string' },
    },
  });
}
