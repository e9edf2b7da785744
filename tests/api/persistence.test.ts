import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { openDatabase } from '../../api/src/db/client';
import { seedDemoData } from '../../api/src/seed/seed-demo';
import { createTestServices } from '../support/test-app';

const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'driftcase-persist-'));
afterAll(() => fs.rmSync(dataDir, { recursive: true, force: true }));

describe('data directory', () => {
  it('keeps a case across a restart and does not seed a second time', async () => {
    const target = { kind: 'pglite-dir' as const, dataDir: path.join(dataDir, 'nested', 'pglite') };
    const first = await openDatabase(target);
    const services = createTestServices(first.db);
    expect(await seedDemoData(services)).toBe(true);
    const { cases } = services;
    const author = (await services.users.listUsers()).find((user) => user.role === 'investigator')!;
    const created = await cases.createCase(
      {
        title: 'Survives a restart',
        site: 'Yard',
        robotId: 'R-1',
        incidentTime: '2026-11-03T12:00:00Z',
        severity: 'low',
      },
      author,
    );
    await first.close();

    const second = await openDatabase(target);
    const reopenedServices = createTestServices(second.db);
    expect(await seedDemoData(reopenedServices)).toBe(false);
    const reopened = await reopenedServices.cases.getCase(created.id);
    expect(reopened.title).toBe('Survives a restart');
    await second.close();
  });
});
