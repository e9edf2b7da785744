import { z } from 'zod';
import {
  type TCaseStatus,
  ZCaseListQuery,
  ZCreateCaseRequest,
  ZUpdateCaseRequest,
} from '../../../shared/contracts/cases';
import { ROLES, type Role } from '../../../shared/roles';
import { bodyField, routeParam } from '../http/audit-facts';
import type { RouteSpec } from '../http/route-spec';
import type { CasesService } from '../services/cases/cases-service';

export const ZCaseParams = z.object({ id: z.uuid('Case id must be a UUID') });

/** Moves a case to another state through the lifecycle, or throws why it may not. */
export type CaseStatusChanger = (caseId: string, to: TCaseStatus, role: Role) => Promise<unknown>;

export function caseRoutes(cases: CasesService, changeStatus: CaseStatusChanger): RouteSpec[] {
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
      audit: {
        action: 'case.create',
        facts: (_req, body) => ({
          targetType: 'case',
          targetId: bodyField(body, 'id'),
          caseId: bodyField(body, 'id'),
        }),
      },
      handler: async (req, res) => {
        const body = ZCreateCaseRequest.parse(req.body);
        res.status(201).json(await cases.createCase(body, req.user.id));
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
      audit: {
        action: 'case.update',
        facts: (req, body) => ({
          targetType: 'case',
          targetId: routeParam(req, 'id'),
          caseId: routeParam(req, 'id'),
          details: {
            fields: Object.keys(req.body ?? {}),
            ...(req.body?.status ? { status: bodyField(body, 'status') } : {}),
          },
        }),
      },
      handler: async (req, res) => {
        const { id } = ZCaseParams.parse(req.params);
        const { status, ...fields } = ZUpdateCaseRequest.parse(req.body);
        // A status change is a lifecycle move like any other, checked by the same state machine.
        if (status && status !== (await cases.getCase(id)).status) {
          await changeStatus(id, status, req.user.role);
        }
        res.json(await cases.updateCase(id, fields));
      },
    },
  ];
}
