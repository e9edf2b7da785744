import { randomUUID } from 'node:crypto';
import { and, asc, count, desc, eq, ilike, or, type SQL, sql } from 'drizzle-orm';
import type {
  TCase,
  TCaseList,
  TCaseListQuery,
  TCreateCaseRequest,
  TUpdateCaseRequest,
} from '../../../../shared/contracts/cases';
import { ZCaseListQuery, ZCreateCaseRequest } from '../../../../shared/contracts/cases';
import { AppError } from '../../../../shared/errors';
import type { Database } from '../../db/client';
import { caseReferenceSeq, cases, users } from '../../db/schema';
import { toCase } from './case-mapper';

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

export function createCasesService({ db }: { db: Database }) {
  const selectWithAuthor = () =>
    db
      .select({ row: cases, authorName: users.name })
      .from(cases)
      .innerJoin(users, eq(users.id, cases.createdBy));

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
      items: rows.map(({ row, authorName }) => toCase(row, { id: row.createdBy, name: authorName })),
      total,
      page: query.page,
      pageSize: query.pageSize,
    };
  }

  async function getCase(id: string): Promise<TCase> {
    const [found] = await selectWithAuthor().where(eq(cases.id, id));
    if (!found) throw new AppError('not_found', `No case with id ${id}.`);
    return toCase(found.row, { id: found.row.createdBy, name: found.authorName });
  }

  async function createCase(request: TCreateCaseRequest, authorId: string): Promise<TCase> {
    const body = ZCreateCaseRequest.parse(request);
    const [{ next }] = await db
      .select({ next: sql<string>`nextval(${caseReferenceSeq.seqName})` })
      .from(sql`(select 1) as one`);
    const id = randomUUID();
    await db.insert(cases).values({
      id,
      reference: `DC-${String(next).padStart(4, '0')}`,
      title: body.title,
      site: body.site,
      robotId: body.robotId,
      incidentTime: new Date(body.incidentTime),
      severity: body.severity,
      summary: body.summary,
      createdBy: authorId,
    });
    return getCase(id);
  }

  async function updateCase(id: string, request: TUpdateCaseRequest): Promise<TCase> {
    const { incidentTime, ...rest } = request;
    const [row] = await db
      .update(cases)
      .set({
        ...rest,
        ...(incidentTime ? { incidentTime: new Date(incidentTime) } : {}),
        updatedAt: new Date(),
      })
      .where(eq(cases.id, id))
      .returning({ id: cases.id });
    if (!row) throw new AppError('not_found', `No case with id ${id}.`);
    return getCase(id);
  }

  return { listCases, getCase, createCase, updateCase };
}

export type CasesService = ReturnType<typeof createCasesService>;
