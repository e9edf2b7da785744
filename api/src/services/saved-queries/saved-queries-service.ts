import { randomUUID } from 'node:crypto';
import { asc, eq } from 'drizzle-orm';
import type { TCreateSavedQueryRequest, TSavedQuery } from '../../../../shared/contracts/saved-queries';
import { AppError } from '../../../../shared/errors';
import { QueryResultError, queryResultSha256 } from '../../../../shared/query-result-hash';
import type { Database } from '../../db/client';
import { bundles, type SavedQueryRow, savedQueries } from '../../db/schema';
import type { Actor } from '../actor';
import type { AuditService } from '../audit/audit-service';
import { loadPeople } from '../findings/people';
import { loadCaseState } from '../lifecycle/case-state';
import { assertCaseMember, assertMemberOfCaseOf } from '../membership/case-access';
import { toSavedQuery } from './saved-query-mapper';

function invalid(path: string, message: string): AppError {
  return new AppError('validation_failed', `${path}: ${message}.`, [{ path, message }]);
}

/**
 * When the preview holds the whole result, the server can check the browser's hash itself, so a
 * saved short result is verified before it becomes evidence.
 */
function assertHashMatchesPreview(request: TCreateSavedQueryRequest): void {
  const { preview, rowCount, columns, resultSha256 } = request;
  if (!preview || preview.length !== rowCount) return;
  let computed: string;
  try {
    computed = queryResultSha256(columns, preview);
  } catch (error) {
    if (error instanceof QueryResultError) throw invalid('preview', error.message);
    throw error;
  }
  if (computed !== resultSha256) {
    throw invalid(
      'resultSha256',
      `The preview is the whole result and its canonical SHA-256 is ${computed}, not ${resultSha256}`,
    );
  }
}

/** SQL queries over a case's bundles, saved with their result hash as evidence. */
const SEE_QUERIES = 'see its saved queries';

export function createSavedQueriesService({ db, audit }: { db: Database; audit: AuditService }) {
  async function withPeople(rows: SavedQueryRow[]): Promise<TSavedQuery[]> {
    const people = await loadPeople(
      db,
      rows.map((row) => row.authorId),
    );
    return rows.map((row) => toSavedQuery(row, people));
  }

  async function saveQuery(
    caseId: string,
    request: TCreateSavedQueryRequest,
    actor: Actor,
  ): Promise<TSavedQuery> {
    const row = await db.transaction(async (tx) => {
      await assertCaseMember(tx, caseId, actor, 'save queries on it');
      const [bundle] = await tx
        .select({ caseId: bundles.caseId })
        .from(bundles)
        .where(eq(bundles.id, request.bundleId));
      if (!bundle || bundle.caseId !== caseId)
        throw invalid('bundleId', `No bundle ${request.bundleId} in this case`);
      assertHashMatchesPreview(request);
      const [inserted] = await tx
        .insert(savedQueries)
        .values({
          id: randomUUID(),
          caseId,
          bundleId: request.bundleId,
          title: request.title,
          sql: request.sql,
          resultSha256: request.resultSha256,
          rowCount: request.rowCount,
          columns: request.columns,
          preview: request.preview ?? null,
          authorId: actor.id,
        })
        .returning();
      await audit.append(tx, {
        actor,
        action: 'saved_query.create',
        targetType: 'saved_query',
        targetId: inserted.id,
        caseId,
        details: { resultSha256: request.resultSha256, rowCount: request.rowCount },
        payload: request,
      });
      return inserted;
    });
    return (await withPeople([row]))[0];
  }

  async function listQueries(caseId: string, actor: Actor): Promise<TSavedQuery[]> {
    await assertCaseMember(db, caseId, actor, SEE_QUERIES);
    return readQueries(caseId);
  }

  /** The case's saved queries, unchecked: for the archive export, which checks membership once. */
  async function readQueries(caseId: string): Promise<TSavedQuery[]> {
    await loadCaseState(db, caseId);
    return withPeople(
      await db
        .select()
        .from(savedQueries)
        .where(eq(savedQueries.caseId, caseId))
        .orderBy(asc(savedQueries.createdAt)),
    );
  }

  async function getQuery(queryId: string, actor: Actor): Promise<TSavedQuery> {
    await assertMemberOfCaseOf(db, 'savedQuery', queryId, actor, SEE_QUERIES);
    const [row] = await db.select().from(savedQueries).where(eq(savedQueries.id, queryId));
    if (!row) throw new AppError('not_found', `No saved query with id ${queryId}.`);
    return (await withPeople([row]))[0];
  }

  return { saveQuery, listQueries, readQueries, getQuery };
}

export type SavedQueriesService = ReturnType<typeof createSavedQueriesService>;
