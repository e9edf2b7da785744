import type { RouteSpec } from '../http/route-spec';
import type { SigningKeyStore } from '../services/signing/signing-key';

export function keyRoutes(keys: SigningKeyStore): RouteSpec[] {
  return [
    {
      // Public keys are public: anyone checking an archive may fetch them without an account.
      method: 'get',
      path: '/keys',
      access: 'public',
      handler: async (_req, res) => {
        res.setHeader('Content-Type', 'application/jwk-set+json');
        res.send(JSON.stringify(await keys.jwks()));
      },
    },
  ];
}
