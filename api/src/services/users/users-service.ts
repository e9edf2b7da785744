import { randomUUID } from 'node:crypto';
import { asc, eq } from 'drizzle-orm';
import {
  type TCreateUserRequest,
  type TUpdateUserRequest,
  type TUser,
  ZUpdateUserRequest,
} from '../../../../shared/contracts/users';
import { AppError } from '../../../../shared/errors';
import type { Database, Transaction } from '../../db/client';
import { isUniqueViolation } from '../../db/postgres-errors';
import { type UserRow, users } from '../../db/schema';
import type { Actor } from '../actor';
import type { AuditService } from '../audit/audit-service';
import type { PasswordHashing } from '../auth/password-hashing';

export function toUser(row: UserRow): TUser {
  return {
    id: row.id,
    email: row.email,
    name: row.name,
    role: row.role,
    active: row.active,
    createdAt: row.createdAt.toISOString(),
  };
}

export interface UsersServiceOptions {
  db: Database;
  audit: AuditService;
  hashing: PasswordHashing;
  /** Ends a deactivated account's sessions inside the deactivation's transaction. */
  revokeAllSessions: (tx: Transaction, userId: string) => Promise<void>;
}

export function createUsersService({ db, audit, hashing, revokeAllSessions }: UsersServiceOptions) {
  async function listUsers(): Promise<TUser[]> {
    const rows = await db.select().from(users).orderBy(asc(users.name));
    return rows.map(toUser);
  }

  /** `actor` is null when the system itself creates the account (the demo seed). */
  async function createUser(request: TCreateUserRequest, actor: Actor | null): Promise<TUser> {
    const passwordHash = await hashing.hash(request.password);
    try {
      return await db.transaction(async (tx) => {
        const [row] = await tx
          .insert(users)
          .values({
            id: randomUUID(),
            email: request.email,
            name: request.name,
            role: request.role,
            passwordHash,
          })
          .returning();
        await audit.append(tx, {
          actor,
          action: 'user.create',
          targetType: 'user',
          targetId: row.id,
          details: { role: row.role },
          // The password stays out: a hash of a short password could be guessed back.
          payload: { email: request.email, name: request.name, role: request.role },
        });
        return toUser(row);
      });
    } catch (error) {
      if (isUniqueViolation(error)) {
        throw new AppError('conflict', `A user with the e-mail ${request.email} already exists.`, [
          { path: 'email', message: 'Already in use' },
        ]);
      }
      throw error;
    }
  }

  async function updateUser(id: string, request: TUpdateUserRequest, actor: Actor): Promise<TUser> {
    const changes = ZUpdateUserRequest.parse(request);
    if (id === actor.id && (changes.active === false || (changes.role && changes.role !== 'admin'))) {
      throw new AppError('conflict', 'You cannot deactivate yourself or remove your own admin role.');
    }
    return db.transaction(async (tx) => {
      const [row] = await tx
        .update(users)
        .set({ ...changes, updatedAt: new Date() })
        .where(eq(users.id, id))
        .returning();
      if (!row) throw new AppError('not_found', `No user with id ${id}.`);
      if (changes.active === false) await revokeAllSessions(tx, id);
      await audit.append(tx, {
        actor,
        action: 'user.update',
        targetType: 'user',
        targetId: id,
        details: {
          fields: Object.keys(changes),
          ...(changes.role ? { role: changes.role } : {}),
          ...(changes.active !== undefined ? { active: changes.active } : {}),
        },
        payload: changes,
      });
      return toUser(row);
    });
  }

  return { listUsers, createUser, updateUser };
}

export type UsersService = ReturnType<typeof createUsersService>;
