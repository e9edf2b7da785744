import { type AuditChainEntry, auditChainOf, verifyAuditChain } from '../../../shared/audit-chain';
import { ZAuditListQuery } from '../../../shared/contracts/audit';
import type { RouteSpec } from '../http/route-spec';
import type { AuditService } from '../services/audit/audit-service';
import type { CheckpointService } from '../services/audit/checkpoint-service';
import { ZCaseParams } from './cases';

const AUDIT_READERS = ['reviewer', 'legal', 'admin'] as const;

/** The chain's own hash check plus its comparison with the signed checkpoints kept outside the database. */
async function verifyWithCheckpoints(
  checkpoints: CheckpointService,
  chain: string,
  entries: AuditChainEntry[],
) {
  const report = verifyAuditChain(entries);
  const compared = await checkpoints.compareChain(chain, entries);
  return { ...report, ok: report.ok && compared.problems.length === 0, checkpoints: compared };
}

export function auditRoutes(audit: AuditService, checkpoints: CheckpointService): RouteSpec[] {
  return [
    {
      method: 'get',
      path: '/cases/:id/audit',
      access: AUDIT_READERS,
      handler: async (req, res) => {
        const { id } = ZCaseParams.parse(req.params);
        res.json(await audit.listCaseEntries(id, ZAuditListQuery.parse(req.query), req.user));
      },
    },
    {
      method: 'get',
      path: '/cases/:id/audit/verify',
      access: AUDIT_READERS,
      handler: async (req, res) => {
        const { id } = ZCaseParams.parse(req.params);
        res.json(
          await verifyWithCheckpoints(
            checkpoints,
            auditChainOf(id),
            await audit.readCaseChainFor(id, req.user),
          ),
        );
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
        const chain = auditChainOf(null);
        res.json(await verifyWithCheckpoints(checkpoints, chain, await audit.readChain(chain)));
      },
    },
  ];
}
