import { ZPlaceHoldRequest, ZReleaseHoldRequest } from '../../../shared/contracts/holds';
import { ROLES } from '../../../shared/roles';
import type { RouteSpec } from '../http/route-spec';
import type { HoldsService } from '../services/holds/holds-service';
import { ZCaseParams } from './cases';

export function holdRoutes(holds: HoldsService): RouteSpec[] {
  return [
    {
      method: 'get',
      path: '/cases/:id/hold',
      access: ROLES,
      handler: async (req, res) => {
        const { id } = ZCaseParams.parse(req.params);
        res.json(await holds.holdStatus(id, req.user));
      },
    },
    {
      method: 'post',
      path: '/cases/:id/hold',
      access: ['legal'],
      audit: { action: 'hold.place' },
      handler: async (req, res) => {
        const { id } = ZCaseParams.parse(req.params);
        res.status(201).json(await holds.placeHold(id, ZPlaceHoldRequest.parse(req.body), req.user));
      },
    },
    {
      method: 'delete',
      path: '/cases/:id/hold',
      access: ['legal'],
      audit: { action: 'hold.release' },
      handler: async (req, res) => {
        const { id } = ZCaseParams.parse(req.params);
        res.json(await holds.releaseHold(id, ZReleaseHoldRequest.parse(req.body ?? {}), req.user));
      },
    },
  ];
}
