import { randomUUID } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { and, asc, eq } from 'drizzle-orm';
import { AppError } from '../../../../shared/errors';
import { writeArrowTables } from '../../bundles/write-arrow-tables';
import type { Database, Transaction } from '../../db/client';
import { isUniqueViolation } from '../../db/postgres-errors';
import { bundles, replays, users } from '../../db/schema';
import type { Actor } from '../actor';
import type { AuditService } from '../audit/audit-service';
import type { EvidenceStore } from '../evidence/evidence-store';
import type { LifecycleService } from '../lifecycle/lifecycle-service';
import { assertCaseMember, assertMemberOfCaseOf } from '../membership/case-access';
import { type TBundleRecord, toBundleRecord } from './bundle-mapper';
import { createBundleViews } from './bundle-views';
import { storableJson } from './storable-json';
import { type InspectBundle, validateStoredBundle } from './validate-stored-bundle';

export interface BundlesServiceOptions {
  db: Database;
  audit: AuditService;
  lifecycle: LifecycleService;
  evidence: EvidenceStore;
  /** Folder for derived data (Arrow copies); rebuilt from the originals if lost. */
  derivedDir: string;
  maxUnpackedBytes: number;
  /** The bundle reader; tests pass one that fails to show nothing is lost. */
  inspect?: InspectBundle;
}

export interface UploadOutcome {
  bundle: TBundleRecord;
  /** True when these exact bytes were already on this case. */
  isDuplicate: boolean;
}

/** An original a bundle was made from (a robot recording, its map, ...), already stored as evidence. */
type DerivedFrom = { role: string; name: string; sha256: string }[];

/** Table names served to the browser; they match the bundle's file stems. */
const TABLE_NAME = /^[a-z_]{1,40}$/;

const isFile = (file: string) =>
  fs.promises.stat(file).then(
    (stat) => stat.isFile(),
    () => false,
  );

const SEE_EVIDENCE = 'see its evidence';

export function createBundlesService(options: BundlesServiceOptions) {
  const { db, audit, lifecycle, evidence, derivedDir, maxUnpackedBytes, inspect } = options;
  const tablesDir = (bundleId: string) => path.join(derivedDir, 'bundles', bundleId, 'tables');
  const rebuilding = new Map<string, Promise<void>>();
  /** Uploads being read in this process, so a duplicate can wait for the first copy's result. */
  const validating = new Map<string, Promise<TBundleRecord>>();

  const selectWithUploader = (executor: Database = db) =>
    executor
      .select({ row: bundles, uploaderName: users.name })
      .from(bundles)
      .innerJoin(users, eq(users.id, bundles.uploadedBy));

  const assertMemberOfBundleCase = (bundleId: string, actor: Actor) =>
    assertMemberOfCaseOf(db, 'bundle', bundleId, actor, SEE_EVIDENCE);

  async function loadBundle(id: string, executor: Database = db): Promise<TBundleRecord> {
    const [found] = await selectWithUploader(executor).where(eq(bundles.id, id));
    if (!found) throw new AppError('not_found', `No bundle with id ${id}.`);
    return toBundleRecord(found.row, found.uploaderName);
  }

  async function getBundle(id: string, actor: Actor): Promise<TBundleRecord> {
    await assertMemberOfBundleCase(id, actor);
    return loadBundle(id);
  }

  /** Every bundle of a case, unchecked: for the archive export, which checks membership once. */
  async function readCaseBundles(caseId: string): Promise<TBundleRecord[]> {
    const rows = await selectWithUploader()
      .where(eq(bundles.caseId, caseId))
      .orderBy(asc(bundles.uploadedAt));
    return rows.map(({ row, uploaderName }) => toBundleRecord(row, uploaderName));
  }

  async function listCaseBundles(caseId: string, actor: Actor): Promise<TBundleRecord[]> {
    await assertCaseMember(db, caseId, actor, SEE_EVIDENCE);
    return readCaseBundles(caseId);
  }

  /**
   * Keeps the uploaded file as evidence first (content-addressed, read-only), then records its row
   * (status `validating`) with a `bundle.receive` custody entry, and only then parses it: whatever
   * fails while reading, the original and its row remain. An invalid bundle is recorded with its
   * issues. The final status, its `bundle.upload` entry and the case's move into analysis commit
   * together.
   */
  async function uploadBundle(upload: {
    caseId: string;
    tempFile: string;
    originalName: string;
    actor: Actor;
    /** Originals (a robot recording and its files) this bundle was derived from, already stored. */
    derivedFrom?: DerivedFrom;
  }): Promise<UploadOutcome> {
    const { actor } = upload;
    const derivedFrom = upload.derivedFrom ? { derivedFrom: upload.derivedFrom } : {};
    const auditUpload = (tx: Transaction, bundle: TBundleRecord, isDuplicate: boolean) =>
      appendUploadEntry(tx, { actor, bundle, originalName: upload.originalName, isDuplicate, derivedFrom });
    await assertCaseMember(db, upload.caseId, actor, 'add evidence to it').catch(async (error) => {
      await fs.promises.rm(upload.tempFile, { force: true });
      throw error;
    });
    const stored = await evidence.storeUploadedFile(upload.tempFile);
    const existingOutcome = async (): Promise<UploadOutcome | undefined> => {
      const [existing] = await db
        .select({ id: bundles.id })
        .from(bundles)
        .where(and(eq(bundles.caseId, upload.caseId), eq(bundles.sha256, stored.sha256)));
      if (!existing) return undefined;
      // A duplicate arriving while the first copy is read is answered with the finished bundle.
      await validating.get(existing.id)?.catch(() => undefined);
      const bundle = await loadBundle(existing.id);
      await db.transaction((tx) => auditUpload(tx, bundle, true));
      return { bundle, isDuplicate: true };
    };
    const earlier = await existingOutcome();
    if (earlier) return earlier;

    const id = randomUUID();
    const originalName = upload.originalName.slice(0, 255);
    try {
      await db.transaction(async (tx) => {
        await tx.insert(bundles).values({
          id,
          caseId: upload.caseId,
          sha256: stored.sha256,
          sizeBytes: stored.sizeBytes,
          originalName,
          uploadedBy: actor.id,
          status: 'validating',
        });
        await audit.append(tx, {
          actor,
          action: 'bundle.receive',
          targetType: 'bundle',
          targetId: id,
          caseId: upload.caseId,
          details: { sha256: stored.sha256, sizeBytes: stored.sizeBytes, ...derivedFrom },
          payload: { originalName: upload.originalName, sha256: stored.sha256, ...derivedFrom },
        });
      });
    } catch (error) {
      // The same bytes arrived at the same time on another request, which recorded them first:
      // this upload is a duplicate of that bundle, not a failure.
      if (!isUniqueViolation(error)) throw error;
      const concurrent = await existingOutcome();
      if (!concurrent) throw error;
      return concurrent;
    }
    const finished = finishValidation(id, stored.path, upload.originalName, (tx, bundle) =>
      auditUpload(tx, bundle, false).then(() =>
        lifecycle.noteWorkStarted(tx, upload.caseId, actor, 'bundle.upload'),
      ),
    );
    validating.set(id, finished);
    try {
      return { bundle: await finished, isDuplicate: false };
    } finally {
      validating.delete(id);
    }
  }

  /** The `bundle.upload` custody entry: the validated status beside the original's hash. */
  function appendUploadEntry(
    tx: Transaction,
    entry: {
      actor: Actor;
      bundle: TBundleRecord;
      originalName: string;
      isDuplicate: boolean;
      derivedFrom: { derivedFrom?: DerivedFrom } | { resumedAfterRestart: true };
    },
  ) {
    const { bundle } = entry;
    return audit.append(tx, {
      actor: entry.actor,
      action: 'bundle.upload',
      targetType: 'bundle',
      targetId: bundle.id,
      caseId: bundle.caseId,
      details: {
        sha256: bundle.sha256,
        status: bundle.status,
        ...(entry.isDuplicate ? { duplicate: true } : {}),
        ...entry.derivedFrom,
      },
      payload: {
        originalName: entry.originalName,
        sha256: bundle.sha256,
        sizeBytes: bundle.sizeBytes,
        ...entry.derivedFrom,
      },
    });
  }

  /**
   * Finishes uploads the last stop interrupted while they were read: their originals and rows are
   * there (status `validating`), so each is validated again and recorded in the uploader's name.
   * Returns how many were finished.
   */
  async function finishInterruptedUploads(): Promise<number> {
    const stuck = await db
      .select({ row: bundles, actor: { id: users.id, email: users.email, role: users.role } })
      .from(bundles)
      .innerJoin(users, eq(users.id, bundles.uploadedBy))
      .where(eq(bundles.status, 'validating'));
    let finished = 0;
    for (const { row, actor } of stuck) {
      if (validating.has(row.id)) continue;
      await finishValidation(row.id, evidence.pathFor(row.sha256), row.originalName, (tx, bundle) =>
        appendUploadEntry(tx, {
          actor,
          bundle,
          originalName: row.originalName,
          isDuplicate: false,
          derivedFrom: { resumedAfterRestart: true },
        }).then(() => lifecycle.noteWorkStarted(tx, row.caseId, actor, 'bundle.upload')),
      );
      finished += 1;
    }
    return finished;
  }

  /** Reads a received original and records what validation found, with `record` in the same transaction. */
  async function finishValidation(
    id: string,
    storedPath: string,
    originalName: string,
    record: (tx: Transaction, bundle: TBundleRecord) => Promise<unknown>,
  ): Promise<TBundleRecord> {
    const { inspection, issues, tables } = await validateStoredBundle({
      storedPath,
      originalName,
      tablesDir: tablesDir(id),
      maxUnpackedBytes,
      inspect,
    });
    return db.transaction(async (tx) => {
      await tx
        .update(bundles)
        .set({
          status: inspection.ok ? 'valid' : 'invalid',
          // Names and messages come from inside the archive: made storable (jsonb refuses NUL).
          issues: storableJson(issues),
          files: storableJson(inspection.files),
          summary: storableJson(inspection.summary ?? null),
          manifest: inspection.ok ? storableJson(inspection.bundle?.manifest ?? null) : null,
          tables,
        })
        .where(eq(bundles.id, id));
      const validated = await loadBundle(id, tx);
      await record(tx, validated);
      return validated;
    });
  }

  /** Path of a derived Arrow IPC stream file, after checking the bundle and table exist. */
  async function tableFile(bundleId: string, name: string, actor: Actor): Promise<string> {
    const bundle = await getBundle(bundleId, actor);
    if (!TABLE_NAME.test(name) || !bundle.tables.some((table) => table.name === name)) {
      const known = bundle.tables.map((table) => table.name).join(', ') || 'none';
      throw new AppError('not_found', `Bundle ${bundleId} has no table "${name}". Tables: ${known}.`);
    }
    const file = path.join(tablesDir(bundleId), `${name}.arrow`);
    if (!(await isFile(file))) await rebuildTables(bundleId);
    return file;
  }

  /**
   * Arrow tables are derived copies: when one is missing, every table is written again from the
   * parsed original into a fresh folder and moved into place, so a reader never sees half a file.
   */
  async function rebuildTables(bundleId: string): Promise<void> {
    let pending = rebuilding.get(bundleId);
    if (!pending) {
      pending = (async () => {
        const temp = `${tablesDir(bundleId)}.rebuild-${randomUUID()}`;
        try {
          const written = await writeArrowTables(await views.parsedBundle(bundleId), temp);
          await fs.promises.mkdir(tablesDir(bundleId), { recursive: true });
          for (const table of written) {
            await fs.promises.rename(table.file, path.join(tablesDir(bundleId), `${table.name}.arrow`));
          }
        } catch (error) {
          if (error instanceof AppError) throw error;
          throw new AppError(
            'internal',
            `The tables of bundle ${bundleId} are missing and could not be rebuilt from the original: ${(error as Error).message}`,
            undefined,
            { cause: error },
          );
        } finally {
          await fs.promises.rm(temp, { recursive: true, force: true });
        }
      })().finally(() => rebuilding.delete(bundleId));
      rebuilding.set(bundleId, pending);
    }
    await pending;
  }

  function storedOriginal(bundle: TBundleRecord): { path: string; name: string } {
    return { path: evidence.pathFor(bundle.sha256), name: bundle.originalName };
  }

  const originalFile = async (bundleId: string, actor: Actor) =>
    storedOriginal(await getBundle(bundleId, actor));

  const views = createBundleViews({
    originalPath: async (bundleId) => storedOriginal(await loadBundle(bundleId)).path,
    isReplayOf: async (bundleId, replayId) => {
      const [found] = await db
        .select({ id: replays.id })
        .from(replays)
        .where(and(eq(replays.id, replayId), eq(replays.bundleId, bundleId)));
      return Boolean(found);
    },
    derivedDir,
    maxUnpackedBytes,
  });

  /** The workspace views, each checked against the case's membership first. */
  const checkedViews = {
    bundleMap: async (bundleId: string, actor: Actor) => {
      await assertMemberOfBundleCase(bundleId, actor);
      return views.bundleMap(bundleId);
    },
    bundleTracks: async (bundleId: string, actor: Actor) => {
      await assertMemberOfBundleCase(bundleId, actor);
      return views.bundleTracks(bundleId);
    },
    replayClearance: async (bundleId: string, replayId: string, actor: Actor) => {
      await assertMemberOfBundleCase(bundleId, actor);
      return views.replayClearance(bundleId, replayId);
    },
  };

  return {
    ...{ uploadBundle, finishInterruptedUploads, listCaseBundles, readCaseBundles, getBundle },
    ...{ tableFile, originalFile, tablesDir },
    ...checkedViews,
    parsedBundle: views.parsedBundle,
  };
}

export type BundlesService = ReturnType<typeof createBundlesService>;
