import { inArray } from 'drizzle-orm';
import type { Database } from '../../db/client';
import { users } from '../../db/schema';

export interface Person {
  id: string;
  name: string;
  email: string;
}

/** Names and e-mails of users by id, for responses and mail. */
export async function loadPeople(db: Database, ids: readonly string[]): Promise<Map<string, Person>> {
  const unique = [...new Set(ids)];
  if (!unique.length) return new Map();
  const rows = await db
    .select({ id: users.id, name: users.name, email: users.email })
    .from(users)
    .where(inArray(users.id, unique));
  return new Map(rows.map((row) => [row.id, row]));
}
