import { randomBytes } from 'node:crypto';
import { eq } from 'drizzle-orm';
import type { Database } from '../../db/client';
import { serverSecrets } from '../../db/schema';

/**
 * Returns the named secret, creating it on first use. `on conflict do nothing` then re-read means
 * two processes starting together still end up with one shared value.
 */
export async function loadOrCreateSecret(db: Database, name: string, bytes = 32): Promise<Buffer> {
  const existing = await db.select().from(serverSecrets).where(eq(serverSecrets.name, name));
  if (existing[0]) return Buffer.from(existing[0].value, 'base64url');
  await db
    .insert(serverSecrets)
    .values({ name, value: randomBytes(bytes).toString('base64url') })
    .onConflictDoNothing();
  const created = await db.select().from(serverSecrets).where(eq(serverSecrets.name, name));
  return Buffer.from(created[0].value, 'base64url');
}
