import { z } from 'zod';
import { ZCaseListQuery, ZCreateCaseRequest, ZUpdateCaseRequest } from '../../../shared/contracts/cases';
import { ROLES } from '../../../shared/roles';
import type { RouteSpec } from '../http/route-spec';
import type { CasesService } from '../services/cases/cases-service';

export const ZCaseParams = z.object({ id: z.uuid('Case id must be a UUID') });

export function caseRoutes(cases: CasesService): RouteSpec[] {
  return [
    {
      method: 'get',
      path: '/cases',
      access: ROLES,
      handler: async (req, res) => {
        res.json(await cases.listCases(ZCaseListQuery.parse(req.query)));
      },
    },
    {
      method: 'post',
      path: '/cases',
      access: ['investigator', 'admin'],
      audit: { action: 'case.create' },
      handler: async (req, res) => {
        const body = ZCreateCaseRequest.parse(req.body);
        res.status(201).json(await cases.createCase(body, req.user));
      },
    },
    {
      method: 'get',
      path: '/cases/:id',
      access: ROLES,
      handler: async (req, res) => {
        const { id } = ZCaseParams.parse(req.params);
        res.json(await cases.getCase(id));
      },
    },
    {
      method: 'patch',
      path: '/cases/:id',
      access: ['investigator', 'admin'],
      audit: { action: 'case.update' },
      handler: async (req, res) => {
        const { id } = ZCaseParams.parse(req.params);
        res.json(await cases.updateCase(id, ZUpdateCaseRequest.parse(req.body), req.user));
      },
    },
  ];
}
