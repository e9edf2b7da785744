import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { TCreateCaseRequest } from '../../../shared/contracts/cases';
import { AppError } from '../../../shared/errors';
import { zipFolder } from '../bundles/zip-folder';
import type { Services } from '../composition/create-services';
import type { Actor } from '../services/actor';
import { DEMO_CASES } from './demo-cases';
import { DEMO_PASSWORD, DEMO_PEOPLE } from './demo-people';

export type DemoSeedServices = Pick<Services, 'users' | 'cases' | 'bundles' | 'replays'>;

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
  const { sampleDir } = options;
  const zipDir = sampleDir ? fs.mkdtempSync(path.join(os.tmpdir(), 'driftcase-seed-')) : '';
  // Replays this seed started that may still be running (see startWithinLimit).
  const started: string[] = [];
  try {
    for (const { sampleFolder, ...demoCase } of DEMO_CASES) {
      const folder = sampleDir ? path.join(sampleDir, sampleFolder) : undefined;
      await seedCase(services, demoCase, investigator, { folder, zipDir, started });
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
  { folder, zipDir, started }: { folder?: string; zipDir: string; started: string[] },
) {
  const created = await services.cases.createCase(demoCase, actor);
  if (!folder || !fs.existsSync(folder)) return;
  const name = path.basename(folder);
  const zip = await zipFolder(folder, path.join(zipDir, `${name}.zip`));
  const { bundle } = await services.bundles.uploadBundle({
    caseId: created.id,
    tempFile: zip,
    originalName: `${name}.zip`,
    actor,
  });
  if (bundle.status === 'valid') await startWithinLimit(services, bundle.id, actor, started);
}

const isLive = (status: string) => status === 'queued' || status === 'running';

/**
 * Starts the demo replay of a bundle. The seed runs as one investigator, and one person may have
 * only a few replays running (MAX_RUNNING_REPLAYS_PER_USER): when that limit answers, it waits for
 * one of its earlier replays to end and tries again, so start-up never fails on its own demo data.
 */
async function startWithinLimit(
  services: DemoSeedServices,
  bundleId: string,
  actor: Actor,
  started: string[],
) {
  for (;;) {
    try {
      const replay = await services.replays.startReplay(bundleId, { label: "Robot's own settings" }, actor);
      started.push(replay.id);
      return;
    } catch (error) {
      if (!(error instanceof AppError && error.code === 'too_many_requests')) throw error;
      await new Promise((resolve) => setTimeout(resolve, 250));
      const states = await Promise.all(started.map((id) => services.replays.getReplay(id)));
      started.splice(0, started.length, ...states.filter((r) => isLive(r.status)).map((r) => r.id));
    }
  }
}
