import type { AppConfig } from '../config';
import type { RouteSpec } from '../http/route-spec';
import type { SessionCookieOptions } from '../http/session-middleware';
import { archiveRoutes } from '../routes/archives';
import { auditRoutes } from '../routes/audit';
import { authRoutes } from '../routes/auth';
import { bookmarkRoutes } from '../routes/bookmarks';
import { bundleRoutes } from '../routes/bundles';
import { caseMemberRoutes } from '../routes/case-members';
import { caseRoutes } from '../routes/cases';
import { evidenceOrphanRoutes } from '../routes/evidence-orphans';
import { figureRoutes } from '../routes/figures';
import { findingsRoutes } from '../routes/findings';
import { fixRoutes } from '../routes/fixes';
import { healthRoutes } from '../routes/health';
import { holdRoutes } from '../routes/holds';
import { keyRoutes } from '../routes/keys';
import { lifecycleRoutes } from '../routes/lifecycle';
import { outboxRoutes } from '../routes/outbox';
import { recordingRoutes } from '../routes/recordings';
import { replayRoutes } from '../routes/replays';
import { savedQueryRoutes } from '../routes/saved-queries';
import { siteRoutes } from '../routes/site';
import { userRoutes } from '../routes/users';
import type { Services } from './create-services';

export function sessionCookieOptions(config: AppConfig): SessionCookieOptions {
  return { secure: config.secureCookies, maxAgeSeconds: config.sessionMaxAgeSeconds };
}

/** Every API route, each given only the services it calls. The only place routes are made. */
export function createRouteSpecs(services: Services, config: AppConfig): RouteSpec[] {
  const uploads = { incomingDir: services.evidence.incoming, maxUploadBytes: config.maxUploadBytes };
  return [
    ...healthRoutes(),
    ...siteRoutes({ timeZone: config.siteTimeZone }),
    ...authRoutes(services.auth, sessionCookieOptions(config)),
    ...userRoutes(services.users),
    ...caseRoutes(services.cases),
    ...caseMemberRoutes(services.caseMembers),
    ...bundleRoutes(services.bundles, uploads),
    ...evidenceOrphanRoutes(services.evidenceOrphans),
    ...recordingRoutes(services.recordings, uploads),
    ...replayRoutes(services.replays),
    ...lifecycleRoutes(services.lifecycle),
    ...findingsRoutes(services.findings, services.reviews),
    ...fixRoutes(services.fixes),
    ...holdRoutes(services.holds),
    ...auditRoutes(services.audit, services.checkpoints),
    ...keyRoutes(services.keys, services.keysAdmin),
    ...outboxRoutes(services.outbox),
    ...archiveRoutes(services.archives, uploads),
    ...bookmarkRoutes(services.bookmarks),
    ...savedQueryRoutes(services.savedQueries),
    ...figureRoutes(services.figures, uploads),
  ];
}
