import { randomUUID } from 'node:crypto';
import fs from 'node:fs';
import { and, asc, eq } from 'drizzle-orm';
import type { TFigure, TFigureFields } from '../../../../shared/contracts/figures';
import { AppError } from '../../../../shared/errors';
import type { Database } from '../../db/client';
import { bundles, type FigureRow, figures, replays } from '../../db/schema';
import type { Actor } from '../actor';
import type { AuditService } from '../audit/audit-service';
import type { EvidenceStore } from '../evidence/evidence-store';
import { loadPeople } from '../findings/people';
import { assertCaseMember } from '../membership/case-access';
import { checkFigureFile } from './check-figure-file';
import { toFigure } from './figure-mapper';

export interface FigureUpload {
  caseId: string;
  tempFile: string;
  fields: TFigureFields;
  actor: Actor;
}

const SEE_FIGURES = 'see its figures';

/** The extension a figure's file gets from its media type, as checked from its bytes. */
const FILE_EXTENSIONS = { 'image/png': 'png', 'image/svg+xml': 'svg' } as const;

/**
 * Pictures saved to a case (the map or the timeline at a moment) for findings to cite. The file
 * is checked by its bytes, then moved into the content-addressed evidence store under its SHA-256,
 * and only then recorded: the row and its `figure.store` entry commit in one transaction.
 */
export function createFiguresService(deps: { db: Database; audit: AuditService; evidence: EvidenceStore }) {
  const { db, audit, evidence } = deps;

  async function withPeople(rows: FigureRow[]): Promise<TFigure[]> {
    const people = await loadPeople(
      db,
      rows.map((row) => row.uploadedBy),
    );
    return rows.map((row) => toFigure(row, people));
  }

  /** A named replay must be one of this case's; the figure then records which moment it shows. */
  async function assertReplayOfCase(caseId: string, replayId: string | undefined) {
    if (!replayId) return;
    const [row] = await db
      .select({ caseId: bundles.caseId })
      .from(replays)
      .innerJoin(bundles, eq(bundles.id, replays.bundleId))
      .where(eq(replays.id, replayId));
    if (!row || row.caseId !== caseId) {
      const message = `No replay ${replayId} in this case`;
      throw new AppError('validation_failed', `Invalid request: replayId: ${message}.`, [
        { path: 'replayId', field: 'replayId', message },
      ]);
    }
  }

  async function storeFigure(upload: FigureUpload): Promise<{ figure: TFigure; duplicate: boolean }> {
    const { caseId, fields, actor } = upload;
    let mediaType: Awaited<ReturnType<typeof checkFigureFile>>;
    try {
      await assertCaseMember(db, caseId, actor, 'save figures to it');
      await assertReplayOfCase(caseId, fields.replayId);
      mediaType = await checkFigureFile(upload.tempFile);
    } catch (error) {
      // A refused upload leaves nothing behind: the file was only ever in incoming/.
      await fs.promises.rm(upload.tempFile, { force: true });
      throw error;
    }
    const kept = await evidence.storeUploadedFile(upload.tempFile);
    // The same bytes saved twice (or by two people at once) are one figure: the insert that loses
    // the race writes nothing, and the figure already recorded is answered as a duplicate.
    const inserted = await db.transaction(async (tx) => {
      const id = randomUUID();
      const [row] = await tx
        .insert(figures)
        .values({
          id,
          caseId,
          sha256: kept.sha256,
          sizeBytes: kept.sizeBytes,
          mediaType,
          fileName: `figure-${kept.sha256.slice(0, 12)}.${FILE_EXTENSIONS[mediaType]}`,
          caption: fields.caption,
          replayId: fields.replayId ?? null,
          step: fields.step ?? null,
          uploadedBy: actor.id,
        })
        .onConflictDoNothing({ target: [figures.caseId, figures.sha256] })
        .returning();
      if (!row) return null;
      await audit.append(tx, {
        actor,
        action: 'figure.store',
        targetType: 'figure',
        targetId: id,
        caseId,
        details: {
          sha256: kept.sha256,
          mediaType,
          sizeBytes: kept.sizeBytes,
          replayId: fields.replayId ?? null,
          step: fields.step ?? null,
        },
        payload: { ...fields, sha256: kept.sha256, mediaType },
      });
      return row;
    });
    if (inserted) return { figure: (await withPeople([inserted]))[0], duplicate: false };
    const [existing] = await db
      .select()
      .from(figures)
      .where(and(eq(figures.caseId, caseId), eq(figures.sha256, kept.sha256)));
    return { figure: (await withPeople([existing]))[0], duplicate: true };
  }

  async function listFigures(caseId: string, actor: Actor): Promise<TFigure[]> {
    await assertCaseMember(db, caseId, actor, SEE_FIGURES);
    return readFigures(caseId);
  }

  /** The case's figures, unchecked: for the archive export, which checks membership once. */
  async function readFigures(caseId: string): Promise<TFigure[]> {
    return withPeople(
      await db
        .select()
        .from(figures)
        .where(eq(figures.caseId, caseId))
        .orderBy(asc(figures.uploadedAt), asc(figures.id)),
    );
  }

  /** The stored file of a figure, for a member of its case. */
  async function figureFile(figureId: string, actor: Actor) {
    const [row] = await db.select().from(figures).where(eq(figures.id, figureId));
    if (!row) throw new AppError('not_found', `No figure with id ${figureId}.`);
    await assertCaseMember(db, row.caseId, actor, SEE_FIGURES);
    return { path: evidence.pathFor(row.sha256), mediaType: row.mediaType, fileName: row.fileName };
  }

  return { storeFigure, listFigures, readFigures, figureFile };
}

export type FiguresService = ReturnType<typeof createFiguresService>;
