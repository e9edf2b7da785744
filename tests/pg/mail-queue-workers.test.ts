import { pino } from 'pino';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { type DatabaseHandle, openDatabase } from '../../api/src/db/client';
import { createMailQueue, type MailQueue } from '../../api/src/services/mail/mail-queue';
import { startCapturingSmtp } from '../support/fake-smtp';
import { resetPostgresDatabase } from '../support/test-database';

/**
 * Two servers on one PostgreSQL each run a mail queue worker over the same `mail_queue` table.
 * Each message must reach the SMTP server once: the claim locks rows with FOR UPDATE SKIP LOCKED
 * (PostgreSQL manual, SELECT, "The Locking Clause").
 */
const url = process.env.DATABASE_URL;
if (!url) throw new Error('Set DATABASE_URL=postgres://... to run the PostgreSQL suite.');

let first: DatabaseHandle;
let second: DatabaseHandle;
let smtp: Awaited<ReturnType<typeof startCapturingSmtp>>;
let workers: MailQueue[];

beforeAll(async () => {
  await resetPostgresDatabase(url);
  // Two connection pools, as two server processes would have.
  first = await openDatabase({ kind: 'postgres', url });
  second = await openDatabase({ kind: 'postgres', url });
  smtp = await startCapturingSmtp();
  const logger = pino({ level: 'silent' });
  workers = [first, second].map((handle) =>
    createMailQueue({ db: handle.db, smtpUrl: smtp.url, from: 'Driftcase <driftcase@localhost>', logger }),
  );
});
afterAll(async () => {
  for (const worker of workers ?? []) await worker.stop();
  await smtp?.close();
  await first?.close();
  await second?.close();
});

describe('mail queue with two workers on one PostgreSQL', () => {
  it('sends every queued message exactly once', async () => {
    const subjects = Array.from({ length: 40 }, (_, i) => `queued message ${i + 1}`);
    for (const subject of subjects) {
      await workers[0].enqueue({
        to: ['legal@driftcase.example'],
        subject,
        text: subject,
        html: `<p>${subject}</p>`,
      });
    }
    // Both workers pass over the queue at the same moment, twice each.
    await Promise.all([workers[0].processDue(), workers[1].processDue()]);
    await Promise.all([workers[0].processDue(), workers[1].processDue()]);

    const received = smtp.messages.map((m) => m.subject).sort();
    expect(received).toEqual([...subjects].sort());
    expect(await workers[1].stats()).toEqual([{ status: 'sent', total: 40 }]);
  });
});
