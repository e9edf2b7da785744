import fs from 'node:fs/promises';
import path from 'node:path';
import { sql } from 'drizzle-orm';
import { CompactSign } from 'jose';
import type { Logger } from 'pino';
import {
  type AuditCheckpoint,
  CHECKPOINT_TYP,
  compareWithCheckpoints,
  readCheckpointLines,
} from '../../archive/compare-checkpoints';
import type { Database } from '../../db/client';
import type { Notifications } from '../mail/notifications';
import { SIGNING_ALG, type SigningKeyStore } from '../signing/signing-key';

const DAY_MS = 24 * 3600 * 1000;

/**
 * Signed checkpoints of every audit chain's head, appended to `DATA_DIR/audit/checkpoints.jsonl`
 * (outside the database) and mailed to legal: at every export, at start-up when the last is a
 * day old, and daily. Comparing a chain with them reports an insider's edit-and-re-chain.
 */
export function createCheckpointService(deps: {
  db: Database;
  keys: SigningKeyStore;
  notify: Notifications;
  dataDir: string;
  logger: Logger;
}) {
  const file = path.join(deps.dataDir, 'audit', 'checkpoints.jsonl');
  let writing: Promise<unknown> = Promise.resolve();

  async function chainHeads(): Promise<{ chain: string; chainSeq: number; entryHash: string }[]> {
    const result = await deps.db.execute(sql`
      select distinct on (chain) chain, chain_seq as "chainSeq", entry_hash as "entryHash"
      from audit_entries order by chain, chain_seq desc`);
    return ((result as { rows?: unknown[] }).rows ?? (result as unknown as unknown[])) as {
      chain: string;
      chainSeq: number;
      entryHash: string;
    }[];
  }

  /** Signs and appends a checkpoint of every chain head; returns the lines written. */
  async function checkpointAll(reason: string): Promise<string[]> {
    const run = writing.then(async () => {
      const key = await deps.keys.current();
      const at = new Date().toISOString();
      const lines: string[] = [];
      for (const head of await chainHeads()) {
        const checkpoint: AuditCheckpoint = { ...head, chainSeq: Number(head.chainSeq), at, reason };
        lines.push(
          await new CompactSign(new TextEncoder().encode(JSON.stringify(checkpoint)))
            .setProtectedHeader({ alg: SIGNING_ALG, kid: key.kid, typ: CHECKPOINT_TYP })
            .sign(key.privateKey),
        );
      }
      if (lines.length === 0) return lines;
      await fs.mkdir(path.dirname(file), { recursive: true });
      await fs.appendFile(file, `${lines.join('\n')}\n`, { mode: 0o644 });
      await deps.notify.auditCheckpointed({ reason, lines });
      return lines;
    });
    writing = run.catch(() => undefined);
    return run;
  }

  async function readLines(): Promise<string[]> {
    try {
      return (await fs.readFile(file, 'utf8')).split('\n').filter((line) => line.trim());
    } catch (error) {
      if ((error as NodeJS.ErrnoException).code === 'ENOENT') return [];
      throw error;
    }
  }

  /** Every checkpoint in the file whose signature verifies against this server's keys. */
  async function readCheckpoints() {
    return readCheckpointLines(await readLines(), await deps.keys.jwks());
  }

  /** The signed lines of one chain, for the archive (the verifier checks their signatures itself). */
  async function linesOfChain(chain: string): Promise<string[]> {
    return (await readLines()).filter((line) => {
      try {
        return JSON.parse(Buffer.from(line.split('.')[1], 'base64url').toString('utf8')).chain === chain;
      } catch {
        return false;
      }
    });
  }

  async function compareChain(chain: string, entries: Parameters<typeof compareWithCheckpoints>[1]) {
    const { checkpoints, problems } = await readCheckpoints();
    const comparison = compareWithCheckpoints(chain, entries, checkpoints);
    return { checked: comparison.checked, problems: [...problems, ...comparison.problems] };
  }

  /** Checkpoints now if the last one is older than a day, then every day; returns the stop function. */
  async function startDaily(): Promise<() => void> {
    const { checkpoints } = await readCheckpoints();
    const last = checkpoints.map((c) => Date.parse(c.at)).reduce((a, b) => Math.max(a, b), 0);
    const run = (reason: string) =>
      checkpointAll(reason).catch((error: unknown) =>
        deps.logger.error({ err: error }, 'audit checkpoint failed'),
      );
    if (Date.now() - last >= DAY_MS) await run('daily');
    const timer = setInterval(() => void run('daily'), DAY_MS);
    timer.unref();
    return () => clearInterval(timer);
  }

  return { checkpointAll, readCheckpoints, readLines, linesOfChain, compareChain, startDaily, file };
}

export type CheckpointService = ReturnType<typeof createCheckpointService>;
