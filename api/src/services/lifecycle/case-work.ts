import type { Logger } from 'pino';
import type { AppConfig } from '../../config';
import type { Database } from '../../db/client';
import type { RouteSpec } from '../../http/route-spec';
import { auditRoutes } from '../../routes/audit';
import { findingsRoutes } from '../../routes/findings';
import { fixRoutes } from '../../routes/fixes';
import { holdRoutes } from '../../routes/holds';
import { keyRoutes } from '../../routes/keys';
import { lifecycleRoutes } from '../../routes/lifecycle';
import { outboxRoutes } from '../../routes/outbox';
import { createAuditService } from '../audit/audit-service';
import { createRouteAuditor } from '../audit/route-auditor';
import { createFindingsService } from '../findings/findings-service';
import { createReviewService } from '../findings/review-service';
import { createFixesService } from '../fixes/fixes-service';
import { createHoldsService } from '../holds/holds-service';
import { createMailQueue } from '../mail/mail-queue';
import { createNotifications } from '../mail/notifications';
import { createSigningKeyStore } from '../signing/signing-key';
import { createLifecycleService } from './lifecycle-service';

/**
 * Builds the case-work services (lifecycle, findings, sign-off, fixes, mail, audit, holds) and
 * their routes, so `createApp` wires them in a few lines.
 */
export function createCaseWork({ db, config, logger }: { db: Database; config: AppConfig; logger: Logger }) {
  const audit = createAuditService({ db });
  const holds = createHoldsService({ db });
  const lifecycle = createLifecycleService({ db, holds });
  const mailQueue = createMailQueue({
    db,
    smtpUrl: config.smtpUrl,
    from: 'Driftcase <driftcase@localhost>',
    logger,
  });
  const notify = createNotifications({ db, queue: mailQueue, publicUrl: config.publicUrl, logger });
  const keys = createSigningKeyStore(config.dataDir);
  const findings = createFindingsService({ db, holds, lifecycle, notify });
  const reviews = createReviewService({ db, findings, lifecycle, notify, keys });
  const fixes = createFixesService({ db, notify });

  // The first bundle of an open case starts its analysis; the move is audited in the case chain.
  audit.onAppended(async (entry) => {
    if (entry.action !== 'bundle.upload' || !entry.caseId) return;
    const moved = await lifecycle.noteWorkStarted(entry.caseId);
    if (!moved) return;
    await audit.append({
      actor: entry.actorId
        ? { id: entry.actorId, email: entry.actorEmail ?? '', role: entry.actorRole ?? '' }
        : null,
      action: 'case.transition',
      targetType: 'case',
      targetId: entry.caseId,
      caseId: entry.caseId,
      payload: moved,
      details: { from: moved.from, to: moved.to, event: moved.event, cause: 'bundle.upload' },
    });
  });

  const routeSpecs: RouteSpec[] = [
    ...lifecycleRoutes(lifecycle),
    ...findingsRoutes(findings, reviews),
    ...fixRoutes(fixes),
    ...holdRoutes(holds),
    ...auditRoutes(audit),
    ...keyRoutes(keys),
    ...outboxRoutes(db),
  ];

  return {
    audit,
    holds,
    lifecycle,
    mailQueue,
    notify,
    keys,
    findings,
    reviews,
    fixes,
    routeSpecs,
    auditor: createRouteAuditor(audit),
  };
}

export type CaseWork = ReturnType<typeof createCaseWork>;
