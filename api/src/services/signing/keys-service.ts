import type { Database } from '../../db/client';
import type { Actor } from '../actor';
import type { AuditService } from '../audit/audit-service';
import type { SigningKeyStore } from './signing-key';

/**
 * Signing-key administration. Rotation retires the current key (its public half stays served at
 * GET /api/keys, so everything it signed still verifies) and signs from then on with a new one.
 */
export function createKeysService({
  db,
  audit,
  store,
}: {
  db: Database;
  audit: AuditService;
  store: SigningKeyStore;
}) {
  async function rotateSigningKey(actor: Actor) {
    const rotation = await store.prepareRotation();
    const at = new Date().toISOString();
    await db.transaction(async (tx) => {
      await audit.append(tx, {
        actor,
        action: 'key.rotate',
        targetType: 'signing_key',
        targetId: rotation.newKid,
        details: {
          retiredKid: rotation.retiredKid,
          newKid: rotation.newKid,
          newThumbprint: rotation.newThumbprint,
        },
      });
      // Inside the transaction: if the files cannot be written, the entry is rolled back with them.
      await rotation.commit(at);
    });
    return store.describe();
  }

  return { describe: store.describe, rotateSigningKey };
}

export type KeysService = ReturnType<typeof createKeysService>;
