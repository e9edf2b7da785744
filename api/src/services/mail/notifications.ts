import { and, eq, inArray } from 'drizzle-orm';
import type { Logger } from 'pino';
import type { Database } from '../../db/client';
import { caseMembers, cases, findingVersions, users } from '../../db/schema';
import type { MailQueue } from './mail-queue';

const escapeHtml = (text: string) =>
  text.replace(
    /[&<>"']/g,
    (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c] ?? c,
  );

/**
 * Who is told what. Every function only enqueues; a failure is logged and swallowed because a
 * notification must never undo or block the action that caused it.
 */
const CHECKPOINT_MAIL_NOTE =
  'Signed checkpoints of every audit chain head, one per line (compact JWS, RFC 7515). Keep this mail outside Driftcase: verify-archive --checkpoints and the server compare the audit trail with them, so rows edited and re-chained afterwards are reported.';

export function createNotifications(options: {
  db: Database;
  queue: MailQueue;
  publicUrl: string;
  logger: Logger;
}) {
  const { db, queue, logger } = options;
  const caseLink = (caseId: string) => `${options.publicUrl.replace(/\/$/, '')}/cases/${caseId}`;

  async function emailsOfRole(role: 'reviewer' | 'legal'): Promise<string[]> {
    const rows = await db
      .select({ email: users.email })
      .from(users)
      .where(and(eq(users.role, role), eq(users.active, true)));
    return rows.map((r) => r.email);
  }

  /**
   * The case's own reviewers; a case with no reviewer member yet goes to every reviewer, so a
   * submission is never left unseen.
   */
  async function emailsOfCaseReviewers(caseId: string): Promise<string[]> {
    const rows = await db
      .select({ email: users.email })
      .from(caseMembers)
      .innerJoin(users, eq(users.id, caseMembers.userId))
      .where(and(eq(caseMembers.caseId, caseId), eq(users.role, 'reviewer'), eq(users.active, true)));
    return rows.length ? rows.map((r) => r.email) : emailsOfRole('reviewer');
  }

  async function emailsOf(ids: string[]): Promise<string[]> {
    if (!ids.length) return [];
    const rows = await db
      .select({ email: users.email })
      .from(users)
      .where(and(inArray(users.id, ids), eq(users.active, true)));
    return rows.map((r) => r.email);
  }

  async function caseInfo(caseId: string) {
    const [row] = await db
      .select({ reference: cases.reference, title: cases.title, createdBy: cases.createdBy })
      .from(cases)
      .where(eq(cases.id, caseId));
    return row ?? { reference: caseId, title: '', createdBy: '' };
  }

  async function send(caseId: string, to: string[], subject: string, lines: string[]) {
    const link = caseLink(caseId);
    await queue.enqueue({
      to,
      subject,
      text: `${lines.join('\n\n')}\n\nOpen the case: ${link}\n`,
      html: `${lines.map((l) => `<p>${escapeHtml(l)}</p>`).join('')}<p><a href="${escapeHtml(link)}">Open the case</a></p>`,
    });
  }

  const guarded =
    <A extends unknown[]>(name: string, fn: (...args: A) => Promise<void>) =>
    async (...args: A) => {
      try {
        await fn(...args);
      } catch (error) {
        logger.error({ err: error, notification: name }, 'notification could not be queued');
      }
    };

  return {
    findingsSubmitted: guarded(
      'findings.submitted',
      async (e: {
        caseId: string;
        caseReference: string;
        title: string;
        version: number;
        author: { name: string };
      }) => {
        await send(
          e.caseId,
          await emailsOfCaseReviewers(e.caseId),
          `[Driftcase] ${e.caseReference}: findings v${e.version} ready for review`,
          [
            `${e.author.name} submitted findings version ${e.version} of case ${e.caseReference} (${e.title}) for review.`,
          ],
        );
      },
    ),
    findingsReviewed: guarded(
      'findings.reviewed',
      async (e: {
        caseId: string;
        version: number;
        authorId: string;
        kind: 'signoff' | 'return';
        reviewerEmail: string;
        comment?: string;
      }) => {
        const info = await caseInfo(e.caseId);
        const verb = e.kind === 'signoff' ? 'signed off' : 'returned with comments';
        await send(
          e.caseId,
          await emailsOf([e.authorId]),
          `[Driftcase] ${info.reference}: findings v${e.version} ${verb}`,
          [
            `${e.reviewerEmail} ${verb} findings version ${e.version} of case ${info.reference} (${info.title}).`,
            ...(e.comment ? [`Comment: ${e.comment}`] : []),
          ],
        );
      },
    ),
    fixLinked: guarded(
      'fix.linked',
      async (e: { caseId: string; description: string; linkedByEmail: string }) => {
        const info = await caseInfo(e.caseId);
        const authors = await db
          .selectDistinct({ id: findingVersions.authorId })
          .from(findingVersions)
          .where(eq(findingVersions.caseId, e.caseId));
        const investigators = await emailsOf([info.createdBy, ...authors.map((a) => a.id)]);
        await send(
          e.caseId,
          [...investigators, ...(await emailsOfRole('reviewer'))],
          `[Driftcase] ${info.reference}: fix linked`,
          [`${e.linkedByEmail} linked a fix to case ${info.reference} (${info.title}): ${e.description}`],
        );
      },
    ),
    /** For the archive export: tells legal that an archive of the case was made. */
    archiveExported: guarded(
      'archive.exported',
      async (e: { caseId: string; sha256: string; exportedByEmail: string }) => {
        const info = await caseInfo(e.caseId);
        await send(
          e.caseId,
          await emailsOfRole('legal'),
          `[Driftcase] ${info.reference}: evidence archive exported`,
          [
            `${e.exportedByEmail} exported the evidence archive of case ${info.reference} (${info.title}).`,
            `Archive SHA-256: ${e.sha256}`,
          ],
        );
      },
    ),
    auditCheckpointed: guarded('audit.checkpointed', async (e: { reason: string; lines: string[] }) => {
      // Legal keeps these mails outside Driftcase: with them an edited and re-chained trail shows.
      await queue.enqueue({
        to: await emailsOfRole('legal'),
        subject: `[Driftcase] audit trail checkpoint (${e.reason})`,
        text: `${CHECKPOINT_MAIL_NOTE}\n\n${e.lines.join('\n')}\n`,
        html: `<p>${escapeHtml(CHECKPOINT_MAIL_NOTE)}</p><pre>${escapeHtml(e.lines.join('\n'))}</pre>`,
      });
    }),
  };
}

export type Notifications = ReturnType<typeof createNotifications>;
