import { randomUUID } from 'node:crypto';
import { and, asc, count, desc, eq, ilike, or, type SQL, sql } from 'drizzle-orm';
import { deriveCasePath } from '../../../../shared/case-path';
import type {
  TCase,
  TCaseList,
  TCaseListQuery,
  TCreateCaseRequest,
  TUpdateCaseRequest,
} from '../../../../shared/contracts/cases';
import { ZCaseListQuery, ZCreateCaseRequest, ZUpdateCaseRequest } from '../../../../shared/contracts/cases';
import { AppError } from '../../../../shared/errors';
import type { Database } from '../../db/client';
import { type CaseRow, caseMembers, caseReferenceSeq, cases, users } from '../../db/schema';
import type { Actor } from '../actor';
import type { AuditService } from '../audit/audit-service';
import { assertNotHeld } from '../holds/holds-service';
import { loadCaseState } from '../lifecycle/case-state';
import type { LifecycleService } from '../lifecycle/lifecycle-service';
import { assertCaseMember } from '../membership/case-access';
import { toCase } from './case-mapper';
import { loadCasePathFacts } from './case-path-facts';

// Severity sorts by rank, not alphabetically.
const SEVERITY_RANK = sql`case ${cases.severity} when 'low' then 1 when 'medium' then 2 when 'high' then 3 else 4 end`;

const SORT_COLUMNS = {
  incidentTime: cases.incidentTime,
  createdAt: cases.createdAt,
  title: cases.title,
  severity: SEVERITY_RANK,
  status: cases.status,
  site: cases.site,
} as const;

function escapeLike(text: string): string {
  return text.replace(/[\\%_]/g, (c) => `\\${c}`);
}

export interface CasesServiceOptions {
  db: Database;
  audit: AuditService;
  lifecycle: LifecycleService;
}

export function createCasesService({ db, audit, lifecycle }: CasesServiceOptions) {
  const selectWithAuthor = () =>
    db
      .select({ row: cases, authorName: users.name })
      .from(cases)
      .innerJoin(users, eq(users.id, cases.createdBy));

  /** Case rows with their authors as the API gives them, each with its path worked out. */
  async function withPaths(found: { row: CaseRow; authorName: string }[]): Promise<TCase[]> {
    const facts = await loadCasePathFacts(
      db,
      found.map(({ row }) => row),
    );
    return found.map(({ row, authorName }) => {
      const caseFacts = facts.get(row.id);
      if (!caseFacts) throw new Error(`case path facts missing for ${row.id}`);
      return toCase(row, { id: row.createdBy, name: authorName }, deriveCasePath(caseFacts));
    });
  }

  async function listCases(rawQuery: TCaseListQuery): Promise<TCaseList> {
    const query = ZCaseListQuery.parse(rawQuery);
    const filters: SQL[] = [];
    if (query.status) filters.push(eq(cases.status, query.status));
    if (query.severity) filters.push(eq(cases.severity, query.severity));
    if (query.site) filters.push(ilike(cases.site, `%${escapeLike(query.site)}%`));
    if (query.q) {
      const pattern = `%${escapeLike(query.q)}%`;
      filters.push(
        or(
          ilike(cases.title, pattern),
          ilike(cases.reference, pattern),
          ilike(cases.robotId, pattern),
        ) as SQL,
      );
    }
    const where = filters.length ? and(...filters) : undefined;
    const direction = query.order === 'asc' ? asc : desc;
    const rows = await selectWithAuthor()
      .where(where)
      .orderBy(direction(SORT_COLUMNS[query.sort]), desc(cases.createdAt), asc(cases.id))
      .limit(query.pageSize)
      .offset((query.page - 1) * query.pageSize);
    const [{ total }] = await db.select({ total: count() }).from(cases).where(where);
    return {
      items: await withPaths(rows),
      total,
      page: query.page,
      pageSize: query.pageSize,
    };
  }

  async function getCase(id: string): Promise<TCase> {
    const [found] = await selectWithAuthor().where(eq(cases.id, id));
    if (!found) throw new AppError('not_found', `No case with id ${id}.`);
    const [item] = await withPaths([found]);
    return item;
  }

  async function createCase(request: TCreateCaseRequest, actor: Actor): Promise<TCase> {
    const body = ZCreateCaseRequest.parse(request);
    const id = await db.transaction(async (tx) => {
      const [{ next }] = await tx
        .select({ next: sql<string>`nextval(${caseReferenceSeq.seqName})` })
        .from(sql`(select 1) as one`);
      const caseId = randomUUID();
      const reference = `DC-${String(next).padStart(4, '0')}`;
      await tx.insert(cases).values({
        id: caseId,
        reference,
        title: body.title,
        site: body.site,
        robotId: body.robotId,
        incidentTime: new Date(body.incidentTime),
        severity: body.severity,
        summary: body.summary,
        createdBy: actor.id,
      });
      // The creator works on the case from the start and manages who else does.
      await tx.insert(caseMembers).values({ caseId, userId: actor.id, addedBy: actor.id });
      await audit.append(tx, {
        actor,
        action: 'case.create',
        targetType: 'case',
        targetId: caseId,
        caseId,
        payload: { ...body, reference },
      });
      return caseId;
    });
    return getCase(id);
  }

  /**
   * Edits the case record. A status change is a lifecycle move like any other, checked by the
   * same state machine, and commits with the edit and its one `case.update` entry.
   */
  async function updateCase(id: string, request: TUpdateCaseRequest, actor: Actor): Promise<TCase> {
    const changes = ZUpdateCaseRequest.parse(request);
    const { status, incidentTime, ...rest } = changes;
    await db.transaction(async (tx) => {
      const current = await loadCaseState(tx, id);
      await assertCaseMember(tx, id, actor, 'edit the case record');
      await assertNotHeld(tx, id, 'Editing the case record');
      if (status && status !== current.status) {
        await lifecycle.transition(tx, id, status, actor.role, true);
      }
      await tx
        .update(cases)
        .set({
          ...rest,
          ...(incidentTime ? { incidentTime: new Date(incidentTime) } : {}),
          updatedAt: new Date(),
        })
        .where(eq(cases.id, id));
      await audit.append(tx, {
        actor,
        action: 'case.update',
        targetType: 'case',
        targetId: id,
        caseId: id,
        details: {
          fields: Object.keys(changes),
          ...(status ? { status } : {}),
        },
        payload: changes,
      });
    });
    return getCase(id);
  }

  return { listCases, getCase, createCase, updateCase };
}

export type CasesService = ReturnType<typeof createCasesService>;
