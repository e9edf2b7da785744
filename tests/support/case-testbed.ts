import fs from 'node:fs';
import request from 'supertest';
import { makeTempDir } from './bundle-fixtures';
import { createTestApp, type TestApp } from './test-app';

export interface CaseTestbed {
  t: TestApp;
  /** Bearer token of the demo investigator. */
  token: string;
  /** Id of the first seeded case. */
  caseId: string;
  /** Scratch folder for zips the test writes. */
  dir: string;
  /** The app's DATA_DIR. */
  dataDir: string;
  close(): Promise<void>;
}

/** An app with its own DATA_DIR, a signed-in investigator and a seeded case to upload to. */
export async function createCaseTestbed(): Promise<CaseTestbed> {
  const dataDir = await makeTempDir('driftcase-data-');
  const t = await createTestApp({ DATA_DIR: dataDir });
  const token = await t.tokenFor('investigator');
  const cases = await request(t.app).get('/api/cases').set('Authorization', `Bearer ${token}`);
  const dir = await makeTempDir();
  return {
    t,
    token,
    caseId: cases.body.items[0].id,
    dir,
    dataDir,
    async close() {
      await t.close();
      fs.rmSync(dir, { recursive: true, force: true });
      fs.rmSync(dataDir, { recursive: true, force: true });
    },
  };
}
