import { ZCaseTransitionRequest } from '../../../shared/contracts/case-lifecycle';
import { ROLES } from '../../../shared/roles';
import type { AuthedRequest, RouteSpec } from '../http/route-spec';
import type { LifecycleService } from '../services/lifecycle/lifecycle-service';
import { ZCaseParams } from './cases';

const caseOf = (req: AuthedRequest) => (req.params as { id: string }).id;

export function lifecycleRoutes(lifecycle: LifecycleService): RouteSpec[] {
  return [
    {
      method: 'get',
      path: '/cases/:id/lifecycle',
      access: ROLES,
      handler: async (req, res) => {
        res.json(await lifecycle.getLifecycle(ZCaseParams.parse(req.params).id));
      },
    },
    {
      method: 'post',
      path: '/cases/:id/transitions',
      access: ['investigator', 'reviewer', 'admin'],
      audit: {
        action: 'case.transition',
        facts: (req, body) => {
          const { from, to, event } = body as { from: string; to: string; event: string };
          return {
            targetType: 'case',
            targetId: caseOf(req),
            caseId: caseOf(req),
            details: { from, to, event, comment: req.body?.comment },
          };
        },
      },
      handler: async (req, res) => {
        const { id } = ZCaseParams.parse(req.params);
        const { to } = ZCaseTransitionRequest.parse(req.body);
        res.json(await lifecycle.transition(id, to, req.user.role, true));
      },
    },
  ];
}
