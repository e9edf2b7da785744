import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { TCreateCaseRequest } from '../../../shared/contracts/cases';
import { zipFolder } from '../bundles/zip-folder';
import type { Services } from '../composition/create-services';
import type { Actor } from '../services/actor';
import { DEMO_CASES } from './demo-cases';
import { DEMO_PASSWORD, DEMO_PEOPLE } from './demo-people';

export type DemoSeedServices = Pick<Services, 'users' | 'cases' | 'caseMembers' | 'bundles' | 'replays'>;

export interface DemoSeedOptions {
  /**
   * Folder holding the sample bundles (`sample-logs/`). When given, each demo case also gets its
   * sample bundle and a replay with the robot's own settings.
   */
  sampleDir?: string;
}

/**
 * Seeds one account per role and the demo cases, only into an empty database: a database that
 * already has users is never touched. Everything goes through the services, so the demo cases
 * have the same audit history real ones would (and the first upload moves a case into analysis).
 */
export async function seedDemoData(
  services: DemoSeedServices,
  options: DemoSeedOptions = {},
): Promise<boolean> {
  if ((await services.users.listUsers()).length > 0) return false;
  const people = [];
  for (const person of DEMO_PEOPLE) {
    people.push(await services.users.createUser({ ...person, password: DEMO_PASSWORD }, null));
  }
  const { id, email, role } = people.find((p) => p.role === 'investigator')!;
  const investigator: Actor = { id, email, role };
  // Every demo account works on every demo case, so each role finds its own work on signing in.
  const team = people.filter((person) => person.role !== 'investigator' && person.role !== 'admin');
  const { sampleDir } = options;
  const zipDir = sampleDir ? fs.mkdtempSync(path.join(os.tmpdir(), 'driftcase-seed-')) : '';
  try {
    for (const { sampleFolder, ...demoCase } of DEMO_CASES) {
      const folder = sampleDir ? path.join(sampleDir, sampleFolder) : undefined;
      await seedCase(services, demoCase, investigator, { folder, zipDir, team: team.map((p) => p.id) });
    }
  } finally {
    if (zipDir) fs.rmSync(zipDir, { recursive: true, force: true });
  }
  return true;
}

async function seedCase(
  services: DemoSeedServices,
  demoCase: TCreateCaseRequest,
  actor: Actor,
  { folder, zipDir, team }: { folder?: string; zipDir: string; team: string[] },
) {
  const created = await services.cases.createCase(demoCase, actor);
  for (const userId of team) await services.caseMembers.addMember(created.id, { userId }, actor);
  if (!folder || !fs.existsSync(folder)) return;
  const name = path.basename(folder);
  const zip = await zipFolder(folder, path.join(zipDir, `${name}.zip`));
  const { bundle } = await services.bundles.uploadBundle({
    caseId: created.id,
    tempFile: zip,
    originalName: `${name}.zip`,
    actor,
  });
  // The demo data is the system's own work, not one person's: the per-person cap does not apply.
  if (bundle.status === 'valid')
    await services.replays.startReplay(bundle.id, { label: "Robot's own settings" }, actor, {
      capped: false,
    });
}
