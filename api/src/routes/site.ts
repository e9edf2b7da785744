import type { TSiteSettings } from '../../../shared/contracts/site';
import type { RouteSpec } from '../http/route-spec';

/** Public, because the sign-in page shows times in the site's zone too. */
export function siteRoutes(settings: TSiteSettings): RouteSpec[] {
  return [
    {
      method: 'get',
      path: '/site',
      access: 'public',
      handler: (_req, res) => {
        res.json(settings);
      },
    },
  ];
}
