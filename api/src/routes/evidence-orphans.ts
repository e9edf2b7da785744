import type { RouteSpec } from '../http/route-spec';
import type { EvidenceOrphans } from '../services/evidence/evidence-orphans';

export function evidenceOrphanRoutes(orphans: EvidenceOrphans): RouteSpec[] {
  return [
    {
      method: 'get',
      path: '/evidence/orphans',
      access: ['admin'],
      handler: async (_req, res) => {
        res.json(await orphans.findOrphans());
      },
    },
  ];
}
