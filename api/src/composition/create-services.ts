import path from 'node:path';
import type { Logger } from 'pino';
import type { AppConfig } from '../config';
import type { Database } from '../db/client';
import { createReplayPool, type ReplayPool } from '../replays/replay-pool';
import { createArchiveService } from '../services/archive/archive-service';
import { createAuditService } from '../services/audit/audit-service';
import { createCheckpointService } from '../services/audit/checkpoint-service';
import { createAuthService } from '../services/auth/auth-service';
import { createPasswordHashing } from '../services/auth/password-hashing';
import { createSignInThrottle } from '../services/auth/sign-in-throttle';
import { createBookmarksService } from '../services/bookmarks/bookmarks-service';
import { createBundlesService } from '../services/bundles/bundles-service';
import { createCasesService } from '../services/cases/cases-service';
import { createEvidenceOrphans } from '../services/evidence/evidence-orphans';
import { createEvidenceStore } from '../services/evidence/evidence-store';
import { createFiguresService } from '../services/figures/figures-service';
import { createFindingsService } from '../services/findings/findings-service';
import { createReviewService } from '../services/findings/review-service';
import { createFixesService } from '../services/fixes/fixes-service';
import { createHoldsService } from '../services/holds/holds-service';
import { createLifecycleService } from '../services/lifecycle/lifecycle-service';
import { createMailQueue } from '../services/mail/mail-queue';
import { createNotifications } from '../services/mail/notifications';
import { createOutboxService } from '../services/mail/outbox-service';
import { createCaseMembersService } from '../services/membership/case-members-service';
import { createImportProgressBoard } from '../services/recordings/import-progress';
import { createRecordingsService } from '../services/recordings/recordings-service';
import { createReplaysService } from '../services/replays/replays-service';
import { createSavedQueriesService } from '../services/saved-queries/saved-queries-service';
import { createKeysService } from '../services/signing/keys-service';
import { createSigningKeyStore } from '../services/signing/signing-key';
import { createUsersService } from '../services/users/users-service';

export interface ServiceDependencies {
  db: Database;
  config: AppConfig;
  logger: Logger;
  /** Worker threads for replays; one is made when not given. */
  replayPool?: ReplayPool;
}

/**
 * Creates every service once, each with the services it calls passed in. This is the only place
 * services are created; a write's side effects (a status change, a notification) are explicit
 * calls inside the service that does the write, never listeners wired here.
 */
export function createServices({ db, config, logger, replayPool }: ServiceDependencies) {
  const audit = createAuditService({ db });
  const passwordHashing = createPasswordHashing();
  const auth = createAuthService({
    db,
    audit,
    hashing: passwordHashing,
    throttle: createSignInThrottle({ db }),
    sessionTtlSeconds: config.sessionTtlSeconds,
    sessionMaxAgeSeconds: config.sessionMaxAgeSeconds,
  });
  const users = createUsersService({
    ...{ db, audit, hashing: passwordHashing },
    revokeAllSessions: auth.revokeAllSessions,
  });
  const holds = createHoldsService({ db, audit });
  const lifecycle = createLifecycleService({ db, audit });
  const cases = createCasesService({ db, audit, lifecycle });
  const caseMembers = createCaseMembersService({ db, audit });

  const evidence = createEvidenceStore(config.dataDir);
  const evidenceOrphans = createEvidenceOrphans({ db, evidence, dataDir: config.dataDir });
  const derivedDir = path.join(config.dataDir, 'derived');
  const { maxUnpackedBytes } = config;
  const bundles = createBundlesService({ db, audit, lifecycle, evidence, derivedDir, maxUnpackedBytes });
  const recordings = createRecordingsService({
    db,
    audit,
    bundles,
    evidence,
    progress: createImportProgressBoard(),
  });
  const replayWorkers = replayPool ?? createReplayPool();
  const replays = createReplaysService({
    ...{ db, audit, evidence, derivedDir, logger, maxUnpackedBytes },
    pool: replayWorkers,
    maxRunningPerUser: config.maxRunningReplaysPerUser,
    loadBundle: bundles.parsedBundle,
  });

  const mailQueue = createMailQueue({
    db,
    smtpUrl: config.smtpUrl,
    from: 'Driftcase <driftcase@localhost>',
    logger,
  });
  const notify = createNotifications({ db, queue: mailQueue, publicUrl: config.publicUrl, logger });
  const outbox = createOutboxService({ db });
  const keys = createSigningKeyStore(config.dataDir);
  const keysAdmin = createKeysService({ db, audit, store: keys });
  const findings = createFindingsService({ db, audit, lifecycle, notify, replayCauses: replays.causesOf });
  const reviews = createReviewService({ db, audit, findings, lifecycle, notify, keys });
  const fixes = createFixesService({ db, audit, notify });
  const bookmarks = createBookmarksService({ db, audit });
  const savedQueries = createSavedQueriesService({ db, audit });
  const figures = createFiguresService({ db, audit, evidence });

  const checkpoints = createCheckpointService({ db, keys, notify, dataDir: config.dataDir, logger });
  const archives = createArchiveService({
    db,
    sources: {
      getCase: cases.getCase,
      listCaseBundles: bundles.readCaseBundles,
      originalPathFor: evidence.pathFor,
      listBundleReplays: replays.readBundleReplays,
      replayResultDir: replays.resultDir,
      listFindingsVersions: findings.readVersions,
      getFindingsVersion: reviews.readVersion,
      listFixes: fixes.readFixes,
      readCaseChain: audit.readCaseChain,
      checkpointLines: checkpoints.linesOfChain,
      jwks: keys.jwks,
      workspace: { listBookmarks: bookmarks.readBookmarks, listSavedQueries: savedQueries.readQueries },
      listFigures: figures.readFigures,
    },
    ...{ keys, audit, notify, checkpoints, maxUnpackedBytes, siteTimeZone: config.siteTimeZone },
  });

  return {
    audit,
    passwordHashing,
    auth,
    users,
    holds,
    lifecycle,
    cases,
    caseMembers,
    evidence,
    evidenceOrphans,
    bundles,
    recordings,
    replays,
    replayWorkers,
    mailQueue,
    notify,
    outbox,
    keys,
    keysAdmin,
    findings,
    reviews,
    fixes,
    bookmarks,
    savedQueries,
    figures,
    archives,
    checkpoints,
  };
}

export type Services = ReturnType<typeof createServices>;
