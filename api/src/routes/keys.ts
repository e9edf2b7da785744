import { parseEmptyBody } from '../../../shared/contracts/empty-body';
import type { RouteSpec } from '../http/route-spec';
import type { KeysService } from '../services/signing/keys-service';
import type { SigningKeyStore } from '../services/signing/signing-key';

export function keyRoutes(keys: SigningKeyStore, admin: KeysService): RouteSpec[] {
  return [
    {
      // Public keys are public: anyone checking an archive may fetch them without an account.
      // Retired keys are listed too, so archives they signed still verify.
      method: 'get',
      path: '/keys',
      access: 'public',
      handler: async (_req, res) => {
        res.setHeader('Content-Type', 'application/jwk-set+json');
        res.send(JSON.stringify(await keys.jwks()));
      },
    },
    {
      // The RFC 7638 thumbprints, to compare with the one the site publishes out of band.
      method: 'get',
      path: '/keys/thumbprints',
      access: 'public',
      handler: async (_req, res) => {
        res.json(await admin.describe());
      },
    },
    {
      method: 'post',
      path: '/keys/rotate',
      access: ['admin'],
      audit: { action: 'key.rotate' },
      handler: async (req, res) => {
        parseEmptyBody(req.body);
        res.json(await admin.rotateSigningKey(req.user));
      },
    },
  ];
}
