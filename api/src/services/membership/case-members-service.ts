import { and, asc, eq, inArray, notInArray } from 'drizzle-orm';
import {
  MEMBER_ROLES,
  type TAddCaseMemberRequest,
  type TCaseMember,
  type TCaseMembers,
  type TMemberCandidate,
  type TMemberRole,
  ZAddCaseMemberRequest,
} from '../../../../shared/contracts/case-members';
import { AppError } from '../../../../shared/errors';
import { ROLE_LABELS } from '../../../../shared/roles';
import type { Database } from '../../db/client';
import { caseMembers, cases, users } from '../../db/schema';
import type { Actor } from '../actor';
import type { AuditService } from '../audit/audit-service';

const isMemberRole = (role: string): role is TMemberRole =>
  (MEMBER_ROLES as readonly string[]).includes(role);

/** The case's creator and admins manage its members; loads what the checks and messages need. */
async function loadManagedCase(db: Database, caseId: string, actor: Actor) {
  const [found] = await db
    .select({ reference: cases.reference, title: cases.title, createdBy: cases.createdBy })
    .from(cases)
    .where(eq(cases.id, caseId));
  if (!found) throw new AppError('not_found', `No case with id ${caseId}.`);
  return { ...found, canManage: actor.role === 'admin' || found.createdBy === actor.id };
}

async function assertCanManage(db: Database, caseId: string, actor: Actor) {
  const found = await loadManagedCase(db, caseId, actor);
  if (!found.canManage) {
    throw new AppError(
      'forbidden',
      `Only the creator of case ${found.reference} ("${found.title}") or an administrator can change who works on it.`,
      { caseId, reason: 'not_case_manager' },
    );
  }
  return found;
}

export function createCaseMembersService({ db, audit }: { db: Database; audit: AuditService }) {
  async function memberRows(executor: Database, caseId: string) {
    return executor
      .select({ member: caseMembers, name: users.name, email: users.email, role: users.role })
      .from(caseMembers)
      .innerJoin(users, eq(users.id, caseMembers.userId))
      .where(eq(caseMembers.caseId, caseId))
      .orderBy(asc(users.name));
  }

  /** Who works on the case. Anyone signed in may ask, so a non-member knows whom to ask for access. */
  async function listMembers(caseId: string, actor: Actor): Promise<TCaseMembers> {
    const managed = await loadManagedCase(db, caseId, actor);
    const rows = await memberRows(db, caseId);
    const items: TCaseMember[] = rows
      .filter((row) => isMemberRole(row.role))
      .map((row) => ({
        userId: row.member.userId,
        name: row.name,
        email: row.email,
        role: row.role as TMemberRole,
        isCreator: row.member.userId === managed.createdBy,
        addedAt: row.member.addedAt.toISOString(),
      }));
    const isMember = rows.some((row) => row.member.userId === actor.id);
    return { items, canManage: managed.canManage, canWork: actor.role === 'admin' || isMember };
  }

  /** Active people of a member role who are not yet on the case, for the creator's or an admin's picker. */
  async function listCandidates(caseId: string, actor: Actor): Promise<TMemberCandidate[]> {
    await assertCanManage(db, caseId, actor);
    const current = (await memberRows(db, caseId)).map((row) => row.member.userId);
    const rows = await db
      .select({ id: users.id, name: users.name, role: users.role })
      .from(users)
      .where(
        and(
          eq(users.active, true),
          inArray(users.role, [...MEMBER_ROLES]),
          current.length ? notInArray(users.id, current) : undefined,
        ),
      )
      .orderBy(asc(users.name));
    return rows
      .filter((row) => isMemberRole(row.role))
      .map((row) => ({ userId: row.id, name: row.name, role: row.role as TMemberRole }));
  }

  async function addMember(
    caseId: string,
    request: TAddCaseMemberRequest,
    actor: Actor,
  ): Promise<TCaseMembers> {
    const { userId } = ZAddCaseMemberRequest.parse(request);
    await db.transaction(async (tx) => {
      await assertCanManage(tx, caseId, actor);
      const [person] = await tx
        .select({ role: users.role, active: users.active, name: users.name })
        .from(users)
        .where(eq(users.id, userId));
      if (!person)
        throw new AppError('not_found', `No person with id ${userId}.`, [
          { path: 'userId', message: 'Unknown person' },
        ]);
      if (!isMemberRole(person.role)) {
        throw new AppError(
          'validation_failed',
          `${person.name} is an ${ROLE_LABELS[person.role]}; administrators see every case without being members.`,
          [{ path: 'userId', field: 'userId', message: 'Administrators are not case members' }],
        );
      }
      if (!person.active) {
        throw new AppError(
          'validation_failed',
          `${person.name}'s account is deactivated; reactivate it first.`,
          [{ path: 'userId', field: 'userId', message: 'Deactivated account' }],
        );
      }
      const added = await tx
        .insert(caseMembers)
        .values({ caseId, userId, addedBy: actor.id })
        .onConflictDoNothing()
        .returning({ userId: caseMembers.userId });
      if (!added.length) throw new AppError('conflict', `${person.name} is already a member of this case.`);
      await audit.append(tx, {
        actor,
        action: 'case.member_add',
        targetType: 'case',
        targetId: caseId,
        caseId,
        details: { userId, role: person.role },
        payload: { userId, role: person.role },
      });
    });
    return listMembers(caseId, actor);
  }

  async function removeMember(caseId: string, userId: string, actor: Actor): Promise<TCaseMembers> {
    await db.transaction(async (tx) => {
      const managed = await assertCanManage(tx, caseId, actor);
      if (userId === managed.createdBy) {
        throw new AppError('conflict', `The creator of case ${managed.reference} stays a member of it.`);
      }
      const removed = await tx
        .delete(caseMembers)
        .where(and(eq(caseMembers.caseId, caseId), eq(caseMembers.userId, userId)))
        .returning({ userId: caseMembers.userId });
      if (!removed.length)
        throw new AppError('not_found', `Person ${userId} is not a member of case ${managed.reference}.`);
      await audit.append(tx, {
        actor,
        action: 'case.member_remove',
        targetType: 'case',
        targetId: caseId,
        caseId,
        details: { userId },
        payload: { userId },
      });
    });
    return listMembers(caseId, actor);
  }

  return { listMembers, listCandidates, addMember, removeMember };
}

export type CaseMembersService = ReturnType<typeof createCaseMembersService>;
