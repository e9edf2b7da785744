import { ZAuditListQuery } from '../../../shared/contracts/audit';
import type { RouteSpec } from '../http/route-spec';
import type { AuditService } from '../services/audit/audit-service';
import { ZCaseParams } from './cases';

const AUDIT_READERS = ['reviewer', 'legal', 'admin'] as const;

export function auditRoutes(audit: AuditService): RouteSpec[] {
  return [
    {
      method: 'get',
      path: '/cases/:id/audit',
      access: AUDIT_READERS,
      handler: async (req, res) => {
        const { id } = ZCaseParams.parse(req.params);
        res.json(await audit.listCaseEntries(id, ZAuditListQuery.parse(req.query)));
      },
    },
    {
      method: 'get',
      path: '/cases/:id/audit/verify',
      access: AUDIT_READERS,
      handler: async (req, res) => {
        res.json(await audit.verifyCaseChain(ZCaseParams.parse(req.params).id));
      },
    },
    {
      method: 'get',
      path: '/audit',
      access: ['admin', 'legal'],
      handler: async (req, res) => {
        res.json(await audit.listGlobalEntries(ZAuditListQuery.parse(req.query)));
      },
    },
    {
      method: 'get',
      path: '/audit/verify',
      access: ['admin', 'legal'],
      handler: async (_req, res) => {
        res.json(await audit.verifyGlobalChain());
      },
    },
  ];
}
