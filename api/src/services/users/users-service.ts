import { randomUUID } from 'node:crypto';
import { asc, eq } from 'drizzle-orm';
import type { TCreateUserRequest, TUpdateUserRequest, TUser } from '../../../../shared/contracts/users';
import { AppError } from '../../../../shared/errors';
import type { Database } from '../../db/client';
import { isUniqueViolation } from '../../db/postgres-errors';
import { type UserRow, users } from '../../db/schema';
import { hashPassword } from '../auth/passwords';

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
  /** Called when an account is deactivated, so its sessions end at once. */
  onDeactivated?: (userId: string) => Promise<void>;
}

export function createUsersService({ db, onDeactivated }: UsersServiceOptions) {
  async function listUsers(): Promise<TUser[]> {
    const rows = await db.select().from(users).orderBy(asc(users.name));
    return rows.map(toUser);
  }

  async function createUser(request: TCreateUserRequest): Promise<TUser> {
    try {
      const [row] = await db
        .insert(users)
        .values({
          id: randomUUID(),
          email: request.email,
          name: request.name,
          role: request.role,
          passwordHash: await hashPassword(request.password),
        })
        .returning();
      return toUser(row);
    } catch (error) {
      if (isUniqueViolation(error)) {
        throw new AppError('conflict', `A user with the e-mail ${request.email} already exists.`, [
          { path: 'email', message: 'Already in use' },
        ]);
      }
      throw error;
    }
  }

  async function updateUser(id: string, actingUserId: string, request: TUpdateUserRequest): Promise<TUser> {
    if (id === actingUserId && (request.active === false || (request.role && request.role !== 'admin'))) {
      throw new AppError('conflict', 'You cannot deactivate yourself or remove your own admin role.');
    }
    const [row] = await db
      .update(users)
      .set({ ...request, updatedAt: new Date() })
      .where(eq(users.id, id))
      .returning();
    if (!row) throw new AppError('not_found', `No user with id ${id}.`);
    if (request.active === false) await onDeactivated?.(id);
    return toUser(row);
  }

  return { listUsers, createUser, updateUser };
}

export type UsersService = ReturnType<typeof createUsersService>;
