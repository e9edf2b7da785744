import { z } from 'zod';

/** A public signing key as a JWK (RFC 7517), e.g. Ed25519: `{ kty: 'OKP', crv: 'Ed25519', x, kid, alg, use }`. */
export const ZPublicJwk = z.looseObject({
  kty: z.string(),
  kid: z.string(),
  alg: z.string(),
  use: z.literal('sig'),
});
export const ZJwkSet = z.object({ keys: z.array(ZPublicJwk) });
export type TJwkSet = z.infer<typeof ZJwkSet>;

/** `GET /api/keys/thumbprints` (and the answer to `POST /api/keys/rotate`): RFC 7638 JWK thumbprints. */
export const ZKeyThumbprints = z.object({
  current: z.object({ kid: z.string(), thumbprint: z.string(), alg: z.string() }),
  /** Keys that signed earlier archives; still trusted for those. */
  retired: z.array(z.object({ kid: z.string(), thumbprint: z.string(), retiredAt: z.string().nullable() })),
});
export type TKeyThumbprints = z.infer<typeof ZKeyThumbprints>;
