import { ZOutboxQuery } from '../../../shared/contracts/outbox';
import type { RouteSpec } from '../http/route-spec';
import type { OutboxService } from '../services/mail/outbox-service';

export function outboxRoutes(outbox: OutboxService): RouteSpec[] {
  return [
    {
      method: 'get',
      path: '/outbox',
      access: ['admin'],
      handler: async (req, res) => {
        res.json(await outbox.listOutbox(ZOutboxQuery.parse(req.query)));
      },
    },
  ];
}
