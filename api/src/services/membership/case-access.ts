import { and, eq } from 'drizzle-orm';
import { AppError } from '../../../../shared/errors';
import type { Database } from '../../db/client';
import { bookmarks, bundles, caseMembers, cases, replays, savedQueries } from '../../db/schema';
import type { Actor } from '../actor';

/** The caller as the membership check needs it (an `Actor`, or an archive exporter). */
type CaseWorker = Pick<Actor, 'id'> & { role: string };

/**
 * The one membership rule: a case's evidence, findings and workspace are open to its members and
 * to admins, who oversee every case and manage its members. Everyone signed in may still see that
 * a case exists (the case list, its title and status), so they know whom to ask for access.
 * Services call these checks before reading or changing anything recorded on a case.
 */
export async function assertCaseMember(
  db: Database,
  caseId: string,
  actor: CaseWorker,
  what: string,
): Promise<void> {
  const [found] = await db
    .select({ reference: cases.reference, title: cases.title, memberId: caseMembers.userId })
    .from(cases)
    .leftJoin(caseMembers, and(eq(caseMembers.caseId, cases.id), eq(caseMembers.userId, actor.id)))
    .where(eq(cases.id, caseId));
  if (!found) throw new AppError('not_found', `No case with id ${caseId}.`);
  if (actor.role === 'admin' || found.memberId) return;
  throw new AppError(
    'forbidden',
    `You are not a member of case ${found.reference} ("${found.title}"), so you cannot ${what}. Ask the case's creator or an administrator to add you to the case.`,
    { caseId, reference: found.reference, reason: 'not_a_member' },
  );
}

/** Things recorded on a case that routes name by their own id. */
const CASE_OF = {
  bundle: { table: bundles, id: bundles.id, caseId: bundles.caseId, noun: 'bundle' },
  bookmark: { table: bookmarks, id: bookmarks.id, caseId: bookmarks.caseId, noun: 'bookmark' },
  savedQuery: { table: savedQueries, id: savedQueries.id, caseId: savedQueries.caseId, noun: 'saved query' },
} as const;

/** The case a bundle, bookmark or saved query belongs to; 404 when there is no such thing. */
export async function caseIdOf(
  db: Database,
  kind: keyof typeof CASE_OF | 'replay',
  id: string,
): Promise<string> {
  if (kind === 'replay') {
    const [found] = await db
      .select({ caseId: bundles.caseId })
      .from(replays)
      .innerJoin(bundles, eq(bundles.id, replays.bundleId))
      .where(eq(replays.id, id));
    if (!found) throw new AppError('not_found', `No replay with id ${id}.`);
    return found.caseId;
  }
  const source = CASE_OF[kind];
  const [found] = await db.select({ caseId: source.caseId }).from(source.table).where(eq(source.id, id));
  if (!found) throw new AppError('not_found', `No ${source.noun} with id ${id}.`);
  return found.caseId;
}

/** `assertCaseMember` for the case a bundle, replay, bookmark or saved query belongs to; returns that case's id. */
export async function assertMemberOfCaseOf(
  db: Database,
  kind: Parameters<typeof caseIdOf>[1],
  id: string,
  actor: CaseWorker,
  what: string,
): Promise<string> {
  const caseId = await caseIdOf(db, kind, id);
  await assertCaseMember(db, caseId, actor, what);
  return caseId;
}
