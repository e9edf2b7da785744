import { ZCaseTransitionRequest } from '../../../shared/contracts/case-lifecycle';
import { ROLES } from '../../../shared/roles';
import type { RouteSpec } from '../http/route-spec';
import type { LifecycleService } from '../services/lifecycle/lifecycle-service';
import { ZCaseParams } from './cases';

export function lifecycleRoutes(lifecycle: LifecycleService): RouteSpec[] {
  return [
    {
      method: 'get',
      path: '/cases/:id/lifecycle',
      access: ROLES,
      handler: async (req, res) => {
        res.json(await lifecycle.getLifecycle(ZCaseParams.parse(req.params).id, req.user));
      },
    },
    {
      method: 'post',
      path: '/cases/:id/transitions',
      access: ['investigator', 'reviewer', 'admin'],
      audit: { action: 'case.transition' },
      handler: async (req, res) => {
        const { id } = ZCaseParams.parse(req.params);
        res.json(await lifecycle.requestTransition(id, ZCaseTransitionRequest.parse(req.body), req.user));
      },
    },
  ];
}
