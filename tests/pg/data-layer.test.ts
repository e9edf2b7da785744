import pg from 'pg';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { type DatabaseHandle, openDatabase } from '../../api/src/db/client';
import { seedDemoData } from '../../api/src/seed/seed-demo';
import { createAuthService } from '../../api/src/services/auth/auth-service';
import { createCasesService } from '../../api/src/services/cases/cases-service';
import { createUsersService } from '../../api/src/services/users/users-service';

/**
 * The data layer against a real PostgreSQL server (DATABASE_URL), with the same schema and
 * migrations as the embedded PGlite. `.ci/run` starts Debian's PostgreSQL and runs this suite.
 */
const url = process.env.DATABASE_URL;
if (!url) throw new Error('Set DATABASE_URL=postgres://... to run the PostgreSQL data-layer suite.');

let handle: DatabaseHandle;

beforeAll(async () => {
  // Start from an empty server database so the committed migrations run from the first one.
  const admin = new pg.Client({ connectionString: url });
  await admin.connect();
  await admin.query(
    'drop schema if exists public cascade; create schema public; drop schema if exists drizzle cascade;',
  );
  await admin.end();
  handle = await openDatabase({ kind: 'postgres', url });
});
afterAll(() => handle?.close());

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
    expect(await seedDemoData(handle.db)).toBe(true);
    expect(await seedDemoData(handle.db)).toBe(false);
    const users = await createUsersService({ db: handle.db }).listUsers();
    expect(users.map((u) => u.role).sort()).toEqual([
      'admin',
      'engineer',
      'investigator',
      'legal',
      'reviewer',
    ]);
  });

  it('signs in and authenticates through the sessions table', async () => {
    const auth = createAuthService({ db: handle.db, sessionTtlSeconds: 900, sessionMaxAgeSeconds: 3600 });
    const session = await auth.logIn({ email: 'legal@driftcase.example', password: 'driftcase-demo' });
    const checked = await auth.authenticate(session.token, 'bearer');
    expect(checked?.user.role).toBe('legal');
    await auth.logOut(checked!.user.sessionId);
    expect(await auth.authenticate(session.token, 'bearer')).toBeNull();
  });

  it('creates, filters, pages and updates cases with server-side sequences', async () => {
    const service = createCasesService({ db: handle.db });
    const author = (await createUsersService({ db: handle.db }).listUsers())[0];
    const created = await service.createCase(
      {
        title: 'Server-side case',
        site: 'PG yard',
        robotId: 'R-5',
        incidentTime: '2026-11-01T00:00:00Z',
        severity: 'critical',
      },
      author.id,
    );
    expect(created.reference).toMatch(/^DC-\d{4}$/);
    const list = await service.listCases({ site: 'pg yard', sort: 'severity', order: 'desc' });
    expect(list.items.map((c) => c.id)).toEqual([created.id]);
    const updated = await service.updateCase(created.id, { status: 'analysing' });
    expect(updated.status).toBe('analysing');
  });

  it('reports a duplicate e-mail as a conflict', async () => {
    const users = createUsersService({ db: handle.db });
    await expect(
      users.createUser({
        email: 'admin@driftcase.example',
        name: 'Dup',
        role: 'admin',
        password: 'long-enough-password',
      }),
    ).rejects.toMatchObject({ code: 'conflict' });
  });
});
