import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { count } from 'drizzle-orm';
import { zipFolder } from '../bundles/zip-folder';
import type { Database } from '../db/client';
import { users } from '../db/schema';
import type { AuditService } from '../services/audit/audit-service';
import type { BundlesService } from '../services/bundles/bundles-service';
import { createCasesService } from '../services/cases/cases-service';
import type { ReplaysService } from '../services/replays/replays-service';
import { createUsersService } from '../services/users/users-service';
import { DEMO_CASES } from './demo-cases';
import { DEMO_PASSWORD, DEMO_PEOPLE } from './demo-people';

export interface DemoBundleSeeding {
  bundles: BundlesService;
  /**
   * When given, the seeded actions are written to the audit trail as the routes would write them,
   * so demo cases have a history (and the first upload moves a case into analysis).
   */
  audit?: Pick<AuditService, 'append'>;
  /** When given, each sample bundle also gets a replay with the robot's own settings. */
  replays?: ReplaysService;
  /** Folder holding the sample bundles (`sample-logs/`). */
  sampleDir: string;
}

/**
 * Seeds one account per role and the demo cases, only into an empty database: a database that
 * already has users is never touched. With `withBundles`, each case also gets its sample bundle.
 */
export async function seedDemoData(db: Database, withBundles?: DemoBundleSeeding): Promise<boolean> {
  const [{ existing }] = await db.select({ existing: count() }).from(users);
  if (existing > 0) return false;
  const usersService = createUsersService({ db });
  const people = [];
  for (const person of DEMO_PEOPLE) {
    people.push(await usersService.createUser({ ...person, password: DEMO_PASSWORD }));
  }
  const investigator = people.find((p) => p.role === 'investigator')!;
  const casesService = createCasesService({ db });
  const zipDir = withBundles ? fs.mkdtempSync(path.join(os.tmpdir(), 'driftcase-seed-')) : '';
  try {
    for (const { sampleFolder, ...demoCase } of DEMO_CASES) {
      const created = await casesService.createCase(demoCase, investigator.id);
      const actor = { id: investigator.id, email: investigator.email, role: investigator.role };
      const record = (
        action: string,
        targetType: string,
        targetId: string,
        details: Record<string, unknown>,
      ) =>
        withBundles?.audit?.append({
          actor,
          action,
          targetType,
          targetId,
          caseId: created.id,
          payload: details,
          details,
        });
      await record('case.create', 'case', created.id, { reference: created.reference, seeded: true });
      const folder = withBundles && path.join(withBundles.sampleDir, sampleFolder);
      if (!withBundles || !folder || !fs.existsSync(folder)) continue;
      const zip = await zipFolder(folder, path.join(zipDir, `${sampleFolder}.zip`));
      const { bundle } = await withBundles.bundles.uploadBundle({
        caseId: created.id,
        tempFile: zip,
        originalName: `${sampleFolder}.zip`,
        uploaderId: investigator.id,
      });
      await record('bundle.upload', 'bundle', bundle.id, {
        sha256: bundle.sha256,
        status: bundle.status,
        seeded: true,
      });
      if (withBundles.replays && bundle.status === 'valid') {
        const replay = await withBundles.replays.startReplay(
          bundle.id,
          { label: "Robot's own settings" },
          investigator.id,
        );
        await record('replay.start', 'replay', replay.id, { bundleId: bundle.id, seeded: true });
      }
    }
  } finally {
    if (zipDir) fs.rmSync(zipDir, { recursive: true, force: true });
  }
  return true;
}
