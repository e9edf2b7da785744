import { count, desc } from 'drizzle-orm';
import { type TOutboxList, type TOutboxQuery, ZOutboxQuery } from '../../../../shared/contracts/outbox';
import type { Database } from '../../db/client';
import { outboxMessages } from '../../db/schema';

/** Messages the local fake SMTP server captured, newest first. */
export async function listOutbox(db: Database, rawQuery: TOutboxQuery): Promise<TOutboxList> {
  const query = ZOutboxQuery.parse(rawQuery);
  const rows = await db
    .select()
    .from(outboxMessages)
    .orderBy(desc(outboxMessages.id))
    .limit(query.pageSize)
    .offset((query.page - 1) * query.pageSize);
  const [{ total }] = await db.select({ total: count() }).from(outboxMessages);
  return {
    items: rows.map((row) => ({ ...row, receivedAt: row.receivedAt.toISOString() })),
    total,
    page: query.page,
    pageSize: query.pageSize,
  };
}

export function createOutboxService({ db }: { db: Database }) {
  return { listOutbox: (query: TOutboxQuery) => listOutbox(db, query) };
}

export type OutboxService = ReturnType<typeof createOutboxService>;
