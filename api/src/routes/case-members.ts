import { z } from 'zod';
import { ZAddCaseMemberRequest } from '../../../shared/contracts/case-members';
import { parseEmptyBody } from '../../../shared/contracts/empty-body';
import { ROLES } from '../../../shared/roles';
import type { RouteSpec } from '../http/route-spec';
import type { CaseMembersService } from '../services/membership/case-members-service';
import { ZCaseParams } from './cases';

const ZMemberParams = ZCaseParams.extend({ userId: z.uuid('Person id must be a UUID') });

/** Who works on a case; the service lets only the case's creator or an admin change it. */
export function caseMemberRoutes(members: CaseMembersService): RouteSpec[] {
  return [
    {
      method: 'get',
      path: '/cases/:id/members',
      access: ROLES,
      handler: async (req, res) => {
        res.json(await members.listMembers(ZCaseParams.parse(req.params).id, req.user));
      },
    },
    {
      method: 'get',
      path: '/cases/:id/member-candidates',
      access: ROLES,
      handler: async (req, res) => {
        res.json({ items: await members.listCandidates(ZCaseParams.parse(req.params).id, req.user) });
      },
    },
    {
      method: 'post',
      path: '/cases/:id/members',
      access: ['investigator', 'admin'],
      audit: { action: 'case.member_add' },
      handler: async (req, res) => {
        const { id } = ZCaseParams.parse(req.params);
        res.status(201).json(await members.addMember(id, ZAddCaseMemberRequest.parse(req.body), req.user));
      },
    },
    {
      method: 'delete',
      path: '/cases/:id/members/:userId',
      access: ['investigator', 'admin'],
      audit: { action: 'case.member_remove' },
      handler: async (req, res) => {
        const { id, userId } = ZMemberParams.parse(req.params);
        parseEmptyBody(req.body);
        res.json(await members.removeMember(id, userId, req.user));
      },
    },
  ];
}
