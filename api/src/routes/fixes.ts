import { z } from 'zod';
import { ZLinkFixRequest, ZVerifyFixRequest } from '../../../shared/contracts/fixes';
import { ROLES } from '../../../shared/roles';
import type { RouteSpec } from '../http/route-spec';
import type { FixesService } from '../services/fixes/fixes-service';
import { ZCaseParams } from './cases';

const ZFixParams = ZCaseParams.extend({ fixId: z.uuid('Fix id must be a UUID') });

export function fixRoutes(fixes: FixesService): RouteSpec[] {
  return [
    {
      method: 'get',
      path: '/cases/:id/fixes',
      access: ROLES,
      handler: async (req, res) => {
        res.json({ items: await fixes.listFixes(ZCaseParams.parse(req.params).id, req.user) });
      },
    },
    {
      method: 'post',
      path: '/cases/:id/fixes',
      access: ['engineer'],
      audit: { action: 'fix.link' },
      handler: async (req, res) => {
        const { id } = ZCaseParams.parse(req.params);
        res.status(201).json(await fixes.linkFix(id, ZLinkFixRequest.parse(req.body), req.user));
      },
    },
    {
      method: 'post',
      path: '/cases/:id/fixes/:fixId/verify',
      access: ['investigator', 'reviewer'],
      audit: { action: 'fix.verify' },
      handler: async (req, res) => {
        const { id, fixId } = ZFixParams.parse(req.params);
        res.json(await fixes.verifyFix(id, fixId, ZVerifyFixRequest.parse(req.body), req.user));
      },
    },
  ];
}
