import fs from 'node:fs';
import path from 'node:path';
import cookieParser from 'cookie-parser';
import express, { type Express, Router } from 'express';
import helmet from 'helmet';
import type { Logger } from 'pino';
import { pinoHttp } from 'pino-http';
import { AppError } from '../../shared/errors';
import type { AppConfig } from './config';
import type { Database } from './db/client';
import { errorHandler } from './http/error-handler';
import { mountRoutes, type RouteSpec } from './http/route-spec';
import { sessionMiddleware } from './http/session-middleware';
import { createReplayPool, type ReplayPool } from './replays/replay-pool';
import { authRoutes } from './routes/auth';
import { bookmarkRoutes } from './routes/bookmarks';
import { bundleRoutes } from './routes/bundles';
import { caseRoutes } from './routes/cases';
import { healthRoutes } from './routes/health';
import { replayRoutes } from './routes/replays';
import { savedQueryRoutes } from './routes/saved-queries';
import { userRoutes } from './routes/users';
import { createCaseArchives } from './services/archive/case-archives';
import { createAuthService } from './services/auth/auth-service';
import { createBookmarksService } from './services/bookmarks/bookmarks-service';
import { type BundlesService, createBundlesService } from './services/bundles/bundles-service';
import { createCasesService } from './services/cases/cases-service';
import { createEvidenceStore } from './services/evidence/evidence-store';
import { type CaseWork, createCaseWork } from './services/lifecycle/case-work';
import { createReplaysService, type ReplaysService } from './services/replays/replays-service';
import { createSavedQueriesService } from './services/saved-queries/saved-queries-service';
import { createUsersService } from './services/users/users-service';

export interface AppDependencies {
  db: Database;
  config: AppConfig;
  logger: Logger;
  /** Folder with the built web app; when absent only the API is served. */
  webDir?: string;
  /** Worker threads for replays; one is made when not given. */
  replayPool?: ReplayPool;
}

export interface DriftcaseApp extends Express {
  locals: Express['locals'] & {
    routeSpecs: RouteSpec[];
    /** Case-work services; server.ts starts `caseWork.mailQueue`, tests drive it. */
    caseWork: CaseWork;
    replays: ReplaysService;
    bundles: BundlesService;
    /** Stops background work (replay workers); the caller closes the database. */
    shutdown: () => Promise<void>;
  };
}

/** Builds the Express app from its dependencies. It never listens: server.ts and the tests do. */
export function createApp({ db, config, logger, webDir, replayPool }: AppDependencies): DriftcaseApp {
  const app = express() as DriftcaseApp;
  app.disable('x-powered-by');
  app.set('trust proxy', 'loopback');

  const auth = createAuthService({
    db,
    sessionTtlSeconds: config.sessionTtlSeconds,
    sessionMaxAgeSeconds: config.sessionMaxAgeSeconds,
  });
  const users = createUsersService({ db, onDeactivated: auth.revokeAllSessions });
  const cases = createCasesService({ db });
  const evidence = createEvidenceStore(config.dataDir);
  const derivedDir = path.join(config.dataDir, 'derived');
  const bundles = createBundlesService({
    db,
    evidence,
    derivedDir,
    maxUnpackedBytes: config.maxUnpackedBytes,
  });
  const pool = replayPool ?? createReplayPool();
  const replays = createReplaysService({
    db,
    evidence,
    derivedDir,
    pool,
    logger,
    maxUnpackedBytes: config.maxUnpackedBytes,
    loadBundle: bundles.parsedBundle,
  });
  const caseWork = createCaseWork({ db, config, logger });
  const bookmarks = createBookmarksService({ db, holds: caseWork.holds });
  const savedQueries = createSavedQueriesService({ db });
  const archives = createCaseArchives({
    ...{ config, cases, bundles, replays, evidence, derivedDir, caseWork },
    workspace: { listBookmarks: bookmarks.listBookmarks, listSavedQueries: savedQueries.listQueries },
  });
  const cookieOptions = { secure: config.secureCookies, maxAgeSeconds: config.sessionMaxAgeSeconds };

  const routeSpecs: RouteSpec[] = [
    ...healthRoutes(),
    ...authRoutes(auth, cookieOptions),
    ...userRoutes(users),
    ...caseRoutes(cases, (caseId, to, role) => caseWork.lifecycle.transition(caseId, to, role, true)),
    ...bundleRoutes(bundles, { incomingDir: evidence.incoming, maxUploadBytes: config.maxUploadBytes }),
    ...replayRoutes(replays),
    ...caseWork.routeSpecs,
    ...archives.routeSpecs,
    ...bookmarkRoutes(bookmarks),
    ...savedQueryRoutes(savedQueries),
  ];
  app.locals.routeSpecs = routeSpecs;
  app.locals.caseWork = caseWork;
  app.locals.replays = replays;
  app.locals.bundles = bundles;
  app.locals.shutdown = () => pool.close();

  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          'default-src': ["'self'"],
          // DuckDB-wasm compiles WebAssembly and runs in a worker.
          'script-src': ["'self'", "'wasm-unsafe-eval'"],
          'worker-src': ["'self'", 'blob:'],
          'img-src': ["'self'", 'data:', 'blob:'],
          'style-src': ["'self'", "'unsafe-inline'"],
          'connect-src': ["'self'"],
          'font-src': ["'self'", 'data:'],
          'upgrade-insecure-requests': null,
        },
      },
    }),
  );
  app.use(
    pinoHttp({
      logger,
      redact: ['req.headers.authorization', 'req.headers.cookie', 'res.headers["set-cookie"]'],
      customLogLevel: (_req, res, error) => (error || res.statusCode >= 500 ? 'error' : 'info'),
    }),
  );
  app.use(cookieParser());

  const api = Router();
  api.use(express.json({ limit: '2mb' }));
  api.use(sessionMiddleware(auth, cookieOptions));
  mountRoutes(api, routeSpecs, { auditor: caseWork.auditor });
  api.use((req, _res, next) =>
    next(new AppError('not_found', `No API route ${req.method} ${req.baseUrl}${req.path}.`)),
  );
  app.use('/api', api);

  if (webDir && fs.existsSync(path.join(webDir, 'index.html'))) {
    app.use(express.static(webDir, { index: false, maxAge: '1h' }));
    // Client-side routes all load the single page.
    app.get('/{*splat}', (_req, res) => res.sendFile(path.join(webDir, 'index.html')));
  }
  app.use(errorHandler);
  return app;
}
