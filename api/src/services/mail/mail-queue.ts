import { randomUUID } from 'node:crypto';
import { and, asc, eq, inArray, lte, sql } from 'drizzle-orm';
import nodemailer, { type Transporter } from 'nodemailer';
import type { Logger } from 'pino';
import type { Database } from '../../db/client';
import { mailQueue } from '../../db/schema';

export interface OutgoingMail {
  to: string[];
  subject: string;
  text: string;
  html: string;
}

export const MAX_SEND_ATTEMPTS = 6;
const FIRST_RETRY_MS = 5_000;
const LONGEST_RETRY_MS = 30 * 60_000;
/** How long a claimed message stays invisible to other queue workers while one sends it. */
const CLAIM_LEASE_MS = 10 * 60_000;
const BATCH_SIZE = 50;

/** Wait before the next attempt: 5 s, 10 s, 20 s, ... capped at 30 min (exponential backoff). */
export function retryDelayMs(attemptsSoFar: number): number {
  return Math.min(FIRST_RETRY_MS * 2 ** (attemptsSoFar - 1), LONGEST_RETRY_MS);
}

function createTransport(smtpUrl: string): Transporter {
  const url = new URL(smtpUrl);
  return nodemailer.createTransport({
    host: url.hostname,
    port: Number(url.port) || (url.protocol === 'smtps:' ? 465 : 587),
    secure: url.protocol === 'smtps:',
    ignoreTLS: url.searchParams.get('ignoreTLS') === 'true',
    auth: url.username
      ? { user: decodeURIComponent(url.username), pass: decodeURIComponent(url.password) }
      : undefined,
  });
}

/**
 * A persisted outgoing-mail queue. Actions only enqueue (one insert), so a slow or failing mail
 * server never blocks or fails them; a background loop sends, retries with backoff and logs each try.
 */
export function createMailQueue(options: { db: Database; smtpUrl?: string; from: string; logger: Logger }) {
  const { db, logger } = options;
  const transport = options.smtpUrl ? createTransport(options.smtpUrl) : undefined;
  let timer: NodeJS.Timeout | undefined;
  let running: Promise<number> | undefined;

  async function enqueue(mail: OutgoingMail): Promise<void> {
    const to = [...new Set(mail.to)].filter(Boolean);
    if (!to.length) return;
    await db.insert(mailQueue).values({ id: randomUUID(), ...mail, to });
  }

  async function sendOne(row: typeof mailQueue.$inferSelect, now: Date): Promise<void> {
    const attempts = row.attempts + 1;
    const at = now.toISOString();
    try {
      if (!transport) throw new Error('No SMTP server is configured (set SMTP_URL or use the local fake).');
      await transport.sendMail({
        from: options.from,
        to: row.to,
        subject: row.subject,
        text: row.text,
        html: row.html,
      });
      await db
        .update(mailQueue)
        .set({ status: 'sent', attempts, sentAt: now, attemptLog: [...row.attemptLog, { at, ok: true }] })
        .where(eq(mailQueue.id, row.id));
    } catch (error) {
      const message = (error as Error).message;
      const isFinal = attempts >= MAX_SEND_ATTEMPTS;
      logger.warn({ mailId: row.id, attempts, err: message, final: isFinal }, 'mail send failed');
      await db
        .update(mailQueue)
        .set({
          status: isFinal ? 'failed' : 'pending',
          attempts,
          nextAttemptAt: new Date(now.getTime() + retryDelayMs(attempts)),
          attemptLog: [...row.attemptLog, { at, ok: false, error: message }],
        })
        .where(eq(mailQueue.id, row.id));
    }
  }

  /**
   * Claims due messages for this worker: the rows are locked with `FOR UPDATE SKIP LOCKED` (other
   * servers on the same database skip them instead of waiting or taking them too) and their next
   * attempt is pushed past a lease, so once the claim commits no other worker sees them as due. If
   * this process dies mid-send, the message is tried again when the lease runs out.
   */
  async function claimDue(now: Date): Promise<(typeof mailQueue.$inferSelect)[]> {
    return db.transaction(async (tx) => {
      const due = await tx
        .select()
        .from(mailQueue)
        .where(and(eq(mailQueue.status, 'pending'), lte(mailQueue.nextAttemptAt, now)))
        .orderBy(asc(mailQueue.createdAt))
        .limit(BATCH_SIZE)
        .for('update', { skipLocked: true });
      if (!due.length) return [];
      await tx
        .update(mailQueue)
        .set({ nextAttemptAt: new Date(now.getTime() + CLAIM_LEASE_MS) })
        .where(
          inArray(
            mailQueue.id,
            due.map((row) => row.id),
          ),
        );
      return due;
    });
  }

  /** Sends every message due at `now`; returns how many were tried. One pass at a time. */
  function processDue(now = new Date()): Promise<number> {
    running ??= (async () => {
      try {
        const due = await claimDue(now);
        for (const row of due) await sendOne(row, now);
        return due.length;
      } finally {
        running = undefined;
      }
    })();
    return running;
  }

  async function stats() {
    return db
      .select({ status: mailQueue.status, total: sql<number>`count(*)::int` })
      .from(mailQueue)
      .groupBy(mailQueue.status);
  }

  return {
    enqueue,
    processDue,
    stats,
    /** Starts the background loop (server only; tests call processDue themselves). */
    start(intervalMs = 2_000) {
      timer ??= setInterval(() => {
        processDue().catch((error: unknown) => logger.error({ err: error }, 'mail queue pass failed'));
      }, intervalMs);
      timer.unref();
    },
    async stop() {
      if (timer) clearInterval(timer);
      timer = undefined;
      await running;
      transport?.close();
    },
  };
}

export type MailQueue = ReturnType<typeof createMailQueue>;
