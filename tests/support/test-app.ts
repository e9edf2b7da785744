import os from 'node:os';
import path from 'node:path';
import { pino } from 'pino';
import request from 'supertest';
import { createApp, type DriftcaseApp } from '../../api/src/app';
import { createServices, type Services } from '../../api/src/composition/create-services';
import { loadConfig } from '../../api/src/config';
import type { Database, DatabaseHandle } from '../../api/src/db/client';
import type { ReplayPool } from '../../api/src/replays/replay-pool';
import { DEMO_PASSWORD } from '../../api/src/seed/demo-people';
import { seedDemoData } from '../../api/src/seed/seed-demo';
import type { TLoginResponse } from '../../shared/contracts/auth';
import type { Role } from '../../shared/roles';
import { createTestDatabase } from './test-database';

export interface TestApp {
  app: DriftcaseApp;
  database: DatabaseHandle;
  /** Signs in a seeded demo account and returns its bearer token. */
  tokenFor(role: Role): Promise<string>;
  close(): Promise<void>;
}

const testConfig = (env: Record<string, string>) =>
  loadConfig({ DATA_DIR: path.join(os.tmpdir(), `driftcase-test-${process.pid}`), ...env });

/**
 * The Express app over a fresh in-memory database seeded with the demo accounts, or over
 * `options.database` (e.g. a PostgreSQL server in tests/pg/), which it closes with the app.
 */
export async function createTestApp(
  env: Record<string, string> = {},
  options: { database?: DatabaseHandle; replayPool?: ReplayPool } = {},
): Promise<TestApp> {
  const database = options.database ?? (await createTestDatabase());
  const app = createApp({
    db: database.db,
    config: testConfig(env),
    logger: pino({ level: 'silent' }),
    replayPool: options.replayPool,
  });
  await seedDemoData(app.locals.services);
  const tokens = new Map<Role, string>();
  return {
    app,
    database,
    async tokenFor(role) {
      const cached = tokens.get(role);
      if (cached) return cached;
      const response = await request(app)
        .post('/api/auth/login')
        .send({ email: `${role}@driftcase.example`, password: DEMO_PASSWORD })
        .expect(200);
      const token = (response.body as TLoginResponse).token;
      tokens.set(role, token);
      return token;
    },
    close: async () => {
      await app.locals.shutdown();
      await database.close();
    },
  };
}

/** The services of the composition root over `db`, for tests that call services directly. */
export function createTestServices(db: Database, env: Record<string, string> = {}): Services {
  return createServices({ db, config: testConfig(env), logger: pino({ level: 'silent' }) });
}
