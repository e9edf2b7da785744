import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { openDatabase } from '../../api/src/db/client';
import { seedDemoData } from '../../api/src/seed/seed-demo';
import { createCasesService } from '../../api/src/services/cases/cases-service';

const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'driftcase-persist-'));
afterAll(() => fs.rmSync(dataDir, { recursive: true, force: true }));

describe('data directory', () => {
  it('keeps a case across a restart and does not seed a second time', async () => {
    const target = { kind: 'pglite-dir' as const, dataDir: path.join(dataDir, 'nested', 'pglite') };
    const first = await openDatabase(target);
    expect(await seedDemoData(first.db)).toBe(true);
    const cases = createCasesService({ db: first.db });
    const author = (await cases.listCases({})).items[0].createdBy.id;
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
    expect(await seedDemoData(second.db)).toBe(false);
    const reopened = await createCasesService({ db: second.db }).getCase(created.id);
    expect(reopened.title).toBe('Survives a restart');
    await second.close();
  });
});
