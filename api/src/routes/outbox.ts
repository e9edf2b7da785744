import { ZOutboxQuery } from '../../../shared/contracts/outbox';
import type { Database } from '../db/client';
import type { RouteSpec } from '../http/route-spec';
import { listOutbox } from '../services/mail/outbox-service';

export function outboxRoutes(db: Database): RouteSpec[] {
  return [
    {
      method: 'get',
      path: '/outbox',
      access: ['admin'],
      handler: async (req, res) => {
        res.json(await listOutbox(db, ZOutboxQuery.parse(req.query)));
      },
    },
  ];
}
