import pg from 'pg';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Services } from '../../api/src/composition/create-services';
import { type DatabaseHandle, openDatabase } from '../../api/src/db/client';
import { seedDemoData } from '../../api/src/seed/seed-demo';
import { createTestServices } from '../support/test-app';
import { resetPostgresDatabase } from '../support/test-database';

/**
 * The data layer against a real PostgreSQL server (DATABASE_URL), with the same schema and
 * migrations as the embedded PGlite. `.ci/run` starts Debian's PostgreSQL and runs this suite.
 */
const url = process.env.DATABASE_URL;
if (!url) throw new Error('Set DATABASE_URL=postgres://... to run the PostgreSQL data-layer suite.');

let handle: DatabaseHandle;
let services: Services;

beforeAll(async () => {
  await resetPostgresDatabase(url);
  handle = await openDatabase({ kind: 'postgres', url });
  services = createTestServices(handle.db);
});
afterAll(async () => {
  await services?.replayWorkers.close();
  await handle?.close();
});

describe('data layer on PostgreSQL', () => {
  it('runs on a real server', async () => {
    const client = new pg.Client({ connectionString: url });
    await client.connect();
    const { rows } = await client.query('show server_version_num');
    await client.end();
    expect(Number(rows[0].server_version_num)).toBeGreaterThanOrEqual(150000);
    expect(handle.kind).toBe('postgres');
  });

  it('seeds an empty database once and never again', async () => {
    expect(await seedDemoData(services)).toBe(true);
    expect(await seedDemoData(services)).toBe(false);
    const users = await services.users.listUsers();
    expect(users.map((u) => u.role).sort()).toEqual([
      'admin',
      'engineer',
      'investigator',
      'legal',
      'reviewer',
    ]);
  });

  it('signs in and authenticates through the sessions table', async () => {
    const { auth } = services;
    const session = await auth.logIn(
      { email: 'legal@driftcase.example', password: 'driftcase-demo' },
      { address: '127.0.0.1' },
    );
    const checked = await auth.authenticate(session.token, 'bearer');
    expect(checked?.user.role).toBe('legal');
    await auth.logOut(checked!.user);
    expect(await auth.authenticate(session.token, 'bearer')).toBeNull();
  });

  it('creates, filters, pages and updates cases with server-side sequences', async () => {
    const service = services.cases;
    const author = (await services.users.listUsers()).find((user) => user.role === 'investigator')!;
    const created = await service.createCase(
      {
        title: 'Server-side case',
        site: 'PG yard',
        robotId: 'R-5',
        incidentTime: '2026-11-01T00:00:00Z',
        severity: 'critical',
      },
      author,
    );
    expect(created.reference).toMatch(/^DC-\d{4}$/);
    const list = await service.listCases({ site: 'pg yard', sort: 'severity', order: 'desc' });
    expect(list.items.map((c) => c.id)).toEqual([created.id]);
    const updated = await service.updateCase(created.id, { status: 'analysing' }, author);
    expect(updated.status).toBe('analysing');
  });

  it('reports a duplicate e-mail as a conflict', async () => {
    await expect(
      services.users.createUser(
        { email: 'admin@driftcase.example', name: 'Dup', role: 'admin', password: 'long-enough-password' },
        null,
      ),
    ).rejects.toMatchObject({ code: 'conflict' });
  });
});
