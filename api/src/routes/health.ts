import type { RouteSpec } from '../http/route-spec';

export function healthRoutes(): RouteSpec[] {
  return [
    {
      method: 'get',
      path: '/health',
      access: 'public',
      handler: (_req, res) => {
        res.json({ ok: true });
      },
    },
  ];
}
