import { z } from 'zod';
import type { Role } from '../roles';

/** The account roles that take part in a case; admins oversee every case without membership. */
export const MEMBER_ROLES = [
  'investigator',
  'reviewer',
  'engineer',
  'legal',
] as const satisfies readonly Role[];
export type TMemberRole = (typeof MEMBER_ROLES)[number];

export const ZAddCaseMemberRequest = z.strictObject({
  userId: z.uuid('userId must be the id of a person (a UUID)'),
});
export type TAddCaseMemberRequest = z.infer<typeof ZAddCaseMemberRequest>;

export const ZCaseMember = z.object({
  userId: z.string(),
  name: z.string(),
  email: z.string(),
  role: z.enum(MEMBER_ROLES),
  isCreator: z.boolean(),
  addedAt: z.string(),
});
export type TCaseMember = z.infer<typeof ZCaseMember>;

/** A person the case's creator or an admin may add: an active account of a member role. */
export const ZMemberCandidate = z.object({
  userId: z.string(),
  name: z.string(),
  role: z.enum(MEMBER_ROLES),
});
export type TMemberCandidate = z.infer<typeof ZMemberCandidate>;

export const ZCaseMembers = z.object({
  items: z.array(ZCaseMember),
  /** Whether the caller may add and remove members (the case's creator or an admin). */
  canManage: z.boolean(),
  /** Whether the caller may see the case's evidence and findings (a member or an admin). */
  canWork: z.boolean(),
});
export type TCaseMembers = z.infer<typeof ZCaseMembers>;
