import fs from 'node:fs';
import path from 'node:path';
import cookieParser from 'cookie-parser';
import express, { type Express, Router } from 'express';
import helmet from 'helmet';
import { pinoHttp } from 'pino-http';
import { installPlainWords } from '../../shared/contracts/plain-words';
import { AppError } from '../../shared/errors';
import { composeApi } from './composition/compose-api';
import { sessionCookieOptions } from './composition/create-route-specs';
import type { ServiceDependencies, Services } from './composition/create-services';
import { errorHandler } from './http/error-handler';
import { mountRoutes, type RouteSpec } from './http/route-spec';
import { sessionMiddleware } from './http/session-middleware';

export interface AppDependencies extends ServiceDependencies {
  /** Folder with the built web app; when absent only the API is served. */
  webDir?: string;
}

export interface DriftcaseApp extends Express {
  locals: Express['locals'] & {
    routeSpecs: RouteSpec[];
    /** The services the composition root made; server.ts starts `services.mailQueue`, tests drive them. */
    services: Services;
    /** Stops background work (replay workers); the caller closes the database. */
    shutdown: () => Promise<void>;
  };
}

/**
 * Builds the Express app around what the composition root (`composition/`) made. It never
 * listens: server.ts and the tests do.
 */
export function createApp({ webDir, ...dependencies }: AppDependencies): DriftcaseApp {
  installPlainWords();
  const { config, logger } = dependencies;
  const { services, routeSpecs, shutdown } = composeApi(dependencies);
  const app = express() as DriftcaseApp;
  app.disable('x-powered-by');
  app.set('trust proxy', 'loopback');
  app.locals.routeSpecs = routeSpecs;
  app.locals.services = services;
  app.locals.shutdown = shutdown;

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
  api.use(sessionMiddleware(services.auth, sessionCookieOptions(config)));
  mountRoutes(api, routeSpecs);
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
