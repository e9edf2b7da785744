import { randomUUID } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { and, asc, eq } from 'drizzle-orm';
import type { BundleIssue } from '../../../../shared/bundle/types';
import { AppError } from '../../../../shared/errors';
import { inspectBundle } from '../../bundles/inspect-bundle';
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

export interface BundlesServiceOptions {
  db: Database;
  audit: AuditService;
  lifecycle: LifecycleService;
  evidence: EvidenceStore;
  /** Folder for derived data (Arrow copies); rebuilt from the originals if lost. */
  derivedDir: string;
  maxUnpackedBytes: number;
}

export interface UploadOutcome {
  bundle: TBundleRecord;
  /** True when these exact bytes were already on this case. */
  isDuplicate: boolean;
}

/** Table names served to the browser; they match the bundle's file stems. */
const TABLE_NAME = /^[a-z_]{1,40}$/;

const SEE_EVIDENCE = 'see its evidence';

const isFile = (file: string) =>
  fs.promises.stat(file).then(
    (stat) => stat.isFile(),
    () => false,
  );

export function createBundlesService(options: BundlesServiceOptions) {
  const { db, audit, lifecycle, evidence, derivedDir, maxUnpackedBytes } = options;
  const tablesDir = (bundleId: string) => path.join(derivedDir, 'bundles', bundleId, 'tables');
  const rebuilding = new Map<string, Promise<void>>();

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
   * Keeps the uploaded file as evidence first (content-addressed, read-only), then validates it.
   * An invalid bundle is still recorded, with its issues, so nothing brought in is lost. The row,
   * its `bundle.upload` entry and the case's move into analysis commit together.
   */
  async function uploadBundle(upload: {
    caseId: string;
    tempFile: string;
    originalName: string;
    actor: Actor;
    /** Originals (a robot recording and its files) this bundle was derived from, already stored. */
    derivedFrom?: { role: string; name: string; sha256: string }[];
  }): Promise<UploadOutcome> {
    const { actor } = upload;
    const auditUpload = (tx: Transaction, bundle: TBundleRecord, isDuplicate: boolean) =>
      audit.append(tx, {
        actor,
        action: 'bundle.upload',
        targetType: 'bundle',
        targetId: bundle.id,
        caseId: upload.caseId,
        details: {
          sha256: bundle.sha256,
          status: bundle.status,
          ...(isDuplicate ? { duplicate: true } : {}),
          ...(upload.derivedFrom ? { derivedFrom: upload.derivedFrom } : {}),
        },
        payload: {
          originalName: upload.originalName,
          sha256: bundle.sha256,
          sizeBytes: bundle.sizeBytes,
          ...(upload.derivedFrom ? { derivedFrom: upload.derivedFrom } : {}),
        },
      });
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
      const bundle = await loadBundle(existing.id);
      await db.transaction((tx) => auditUpload(tx, bundle, true));
      return { bundle, isDuplicate: true };
    };
    const earlier = await existingOutcome();
    if (earlier) return earlier;

    const id = randomUUID();
    const { inspection, issues, tables } = await validateStored(id, stored.path, upload.originalName);
    try {
      const bundle = await db.transaction(async (tx) => {
        await tx.insert(bundles).values({
          id,
          caseId: upload.caseId,
          sha256: stored.sha256,
          sizeBytes: stored.sizeBytes,
          originalName: upload.originalName.slice(0, 255),
          uploadedBy: actor.id,
          status: inspection.ok ? 'valid' : 'invalid',
          // Names and messages come from inside the archive: made storable (jsonb refuses NUL).
          issues: storableJson(issues),
          files: storableJson(inspection.files),
          summary: storableJson(inspection.summary ?? null),
          manifest: inspection.ok ? storableJson(inspection.bundle?.manifest ?? null) : null,
          tables,
        });
        const inserted = await loadBundle(id, tx);
        await auditUpload(tx, inserted, false);
        await lifecycle.noteWorkStarted(tx, upload.caseId, actor, 'bundle.upload');
        return inserted;
      });
      return { bundle, isDuplicate: false };
    } catch (error) {
      // The same bytes arrived at the same time on another request, which stored them first:
      // this upload is a duplicate of that bundle, not a failure.
      if (!isUniqueViolation(error)) throw error;
      await fs.promises.rm(tablesDir(id), { recursive: true, force: true });
      const concurrent = await existingOutcome();
      if (!concurrent) throw error;
      return concurrent;
    }
  }

  /**
   * Validates a stored original and writes its derived tables. Never throws for what is in the
   * file: a reader failure becomes an issue, so the original is always recorded with a row.
   */
  async function validateStored(id: string, storedPath: string, originalName: string) {
    let inspection: Awaited<ReturnType<typeof inspectBundle>>;
    try {
      inspection = await inspectBundle(
        { kind: 'zip', path: storedPath },
        { maxTotalBytes: maxUnpackedBytes },
      );
    } catch (error) {
      inspection = {
        ok: false,
        files: [],
        issues: [
          {
            file: originalName,
            message: `The archive could not be read: ${String(error)}`,
            severity: 'error',
          },
        ],
      };
    }
    // Issues about the archive itself name the stored copy; show the name the investigator knows.
    const storedName = path.basename(storedPath);
    let issues: BundleIssue[] = inspection.issues.map((issue) =>
      issue.file === storedName ? { ...issue, file: originalName } : issue,
    );
    let tables: { name: string; rows: number }[] = [];
    if (inspection.ok && inspection.bundle) {
      try {
        const written = await writeArrowTables(inspection.bundle, tablesDir(id));
        tables = written.map(({ name, rows }) => ({ name, rows }));
      } catch (error) {
        // Derived data only: the bundle stays valid evidence even if the copy fails.
        issues = [
          ...issues,
          {
            file: '(derived tables)',
            message: `Could not write Arrow tables: ${String(error)}`,
            severity: 'warning',
          },
        ];
      }
    }
    return { inspection, issues, tables };
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
    ...{ uploadBundle, listCaseBundles, readCaseBundles, getBundle, tableFile, originalFile, tablesDir },
    ...checkedViews,
    parsedBundle: views.parsedBundle,
  };
}

export type BundlesService = ReturnType<typeof createBundlesService>;
