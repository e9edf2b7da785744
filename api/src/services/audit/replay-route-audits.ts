import { eq } from 'drizzle-orm';
import type { Database } from '../../db/client';
import { bundles, replays } from '../../db/schema';
import type { AuditDeclaration, AuthedRequest } from '../../http/route-spec';

const param = (req: AuthedRequest, name: string) => (req.params as Record<string, string>)[name];

/** Audit declarations for the replay routes; their case is found through the bundle. */
export function replayRouteAudits(db: Database): Record<string, AuditDeclaration> {
  const caseOfBundle = async (bundleId: string) =>
    (await db.select({ caseId: bundles.caseId }).from(bundles).where(eq(bundles.id, bundleId)))[0]?.caseId ??
    null;
  const caseOfReplay = async (replayId: string) =>
    (
      await db
        .select({ caseId: bundles.caseId })
        .from(replays)
        .innerJoin(bundles, eq(bundles.id, replays.bundleId))
        .where(eq(replays.id, replayId))
    )[0]?.caseId ?? null;
  return {
    'post /bundles/:id/replays': {
      action: 'replay.start',
      facts: async (req, body) => ({
        targetType: 'replay',
        targetId: (body as { id?: string } | undefined)?.id ?? null,
        caseId: await caseOfBundle(param(req, 'id')),
        details: { bundleId: param(req, 'id') },
      }),
    },
    'delete /replays/:id': {
      action: 'replay.delete',
      facts: async (req) => ({
        targetType: 'replay',
        targetId: param(req, 'id'),
        caseId: await caseOfReplay(param(req, 'id')),
      }),
    },
  };
}
