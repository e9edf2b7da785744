import { createHash } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { and, asc, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { auditEntries, bundles, users } from '../../../api/src/db/schema';
import type { Actor } from '../../../api/src/services/actor';
import { createBundlesService } from '../../../api/src/services/bundles/bundles-service';
import type { InspectBundle } from '../../../api/src/services/bundles/validate-stored-bundle';
import { makeBundleFiles, writeBundleZip } from '../../support/bundle-fixtures';
import { type CaseTestbed, createCaseTestbed } from '../../support/case-testbed';

/**
 * "Uploads lose nothing": the original is stored and its row and custody entry are committed
 * before anything reads it, so a validator that fails, or a process that dies while reading,
 * leaves the original and its row. Hashes are checked with Node's own SHA-256 (FIPS 180-4), not
 * the store's.
 */
let bed: CaseTestbed;
let actor: Actor;

beforeAll(async () => {
  bed = await createCaseTestbed();
  const [investigator] = await bed.t.database.db
    .select({ id: users.id, email: users.email, role: users.role })
    .from(users)
    .where(eq(users.email, 'investigator@driftcase.example'));
  actor = investigator;
}, 180_000);
afterAll(() => bed.close());

const sha256Of = (file: string) => createHash('sha256').update(fs.readFileSync(file)).digest('hex');

function bundlesServiceWith(inspect: InspectBundle) {
  const { audit, lifecycle, evidence } = bed.t.app.locals.services;
  return createBundlesService({
    db: bed.t.database.db,
    ...{ audit, lifecycle, evidence, inspect },
    derivedDir: path.join(bed.dataDir, 'derived'),
    maxUnpackedBytes: 64 * 1024 * 1024,
  });
}

const rowsOf = (sha256: string) => bed.t.database.db.select().from(bundles).where(eq(bundles.sha256, sha256));
const actionsFor = async (bundleId: string) =>
  (
    await bed.t.database.db
      .select({ action: auditEntries.action })
      .from(auditEntries)
      .where(and(eq(auditEntries.targetType, 'bundle'), eq(auditEntries.targetId, bundleId)))
      .orderBy(asc(auditEntries.id))
  ).map((entry) => entry.action);

/** Copies the zip to a temporary upload file, as multer would leave it. */
async function uploadedCopy(zip: string, name: string): Promise<string> {
  const temp = path.join(bed.dir, `${name}.upload`);
  await fs.promises.copyFile(zip, temp);
  return temp;
}

describe('an upload is recorded before it is read', () => {
  it('keeps the row, its custody entry and the original when the validator throws', async () => {
    const zip = await writeBundleZip(path.join(bed.dir, 'throws.zip'), makeBundleFiles({ steps: 14 }));
    const sha256 = sha256Of(zip);
    const seenWhileReading: { status?: string; actions?: string[]; hasOriginal?: boolean } = {};
    const failing: InspectBundle = async () => {
      const [row] = await rowsOf(sha256);
      seenWhileReading.status = row?.status;
      seenWhileReading.actions = row ? await actionsFor(row.id) : [];
      seenWhileReading.hasOriginal = fs.existsSync(
        path.join(bed.dataDir, 'evidence', sha256.slice(0, 2), `${sha256}.bin`),
      );
      throw new Error('validator crashed halfway');
    };
    const outcome = await bundlesServiceWith(failing).uploadBundle({
      caseId: bed.caseId,
      tempFile: await uploadedCopy(zip, 'throws'),
      originalName: 'throws.zip',
      actor,
    });

    expect(seenWhileReading).toEqual({
      status: 'validating',
      actions: ['bundle.receive'],
      hasOriginal: true,
    });
    expect(outcome.bundle.status).toBe('invalid');
    expect(outcome.bundle.issues.map((issue) => issue.message).join(' ')).toMatch(
      /validator crashed halfway/,
    );
    const stored = path.join(bed.dataDir, 'evidence', sha256.slice(0, 2), `${sha256}.bin`);
    expect(Buffer.compare(fs.readFileSync(stored), fs.readFileSync(zip))).toBe(0);
    expect(await rowsOf(sha256)).toHaveLength(1);
    expect(await actionsFor(outcome.bundle.id)).toEqual(['bundle.receive', 'bundle.upload']);
  });

  it('leaves a row being checked when the process dies while reading, and finishes it at the next start', async () => {
    const zip = await writeBundleZip(path.join(bed.dir, 'dies.zip'), makeBundleFiles({ steps: 16 }));
    const sha256 = sha256Of(zip);
    let reachedValidator!: () => void;
    const reached = new Promise<void>((resolve) => {
      reachedValidator = resolve;
    });
    // The reader never returns: what a kill -9 in the middle of validation leaves behind.
    const hanging: InspectBundle = () => {
      reachedValidator();
      return new Promise(() => undefined);
    };
    void bundlesServiceWith(hanging).uploadBundle({
      caseId: bed.caseId,
      tempFile: await uploadedCopy(zip, 'dies'),
      originalName: 'dies.zip',
      actor,
    });
    await reached;
    const [left] = await rowsOf(sha256);
    expect(left.status).toBe('validating');
    expect(left.originalName).toBe('dies.zip');
    expect(await actionsFor(left.id)).toEqual(['bundle.receive']);

    // The next start, with the real reader.
    const restarted = bed.t.app.locals.services.bundles;
    expect(await restarted.finishInterruptedUploads()).toBeGreaterThanOrEqual(1);
    const finished = await restarted.getBundle(left.id, actor);
    expect(finished.status).toBe('valid');
    expect(finished.sha256).toBe(sha256);
    expect(await actionsFor(left.id)).toEqual(['bundle.receive', 'bundle.upload']);
  });
});
