import { randomUUID } from 'node:crypto';
import { asc, eq } from 'drizzle-orm';
import type {
  TBookmark,
  TCreateBookmarkRequest,
  TUpdateBookmarkRequest,
} from '../../../../shared/contracts/bookmarks';
import { AppError } from '../../../../shared/errors';
import { REPLAY_STATUS_LABELS } from '../../../../shared/human-labels';
import type { Database, Transaction } from '../../db/client';
import { type BookmarkRow, bookmarks, bundles, replays } from '../../db/schema';
import type { Actor } from '../actor';
import type { AuditService } from '../audit/audit-service';
import { loadPeople } from '../findings/people';
import { assertNotHeld } from '../holds/holds-service';
import { loadCaseState } from '../lifecycle/case-state';
import { assertCaseMember, assertMemberOfCaseOf } from '../membership/case-access';
import { toBookmark } from './bookmark-mapper';
import { findVersionsCitingBookmark } from './cited-by-findings';

function invalid(path: string, message: string): AppError {
  return new AppError('validation_failed', `${path}: ${message}.`, [{ path, message }]);
}

/** Pinned replay moments of a case; findings cite them as evidence. */
/** Audit facts of a bookmark write: the case history shows which replay step it pins. */
function bookmarkEntry(row: BookmarkRow) {
  return {
    targetType: 'bookmark',
    targetId: row.id,
    caseId: row.caseId,
    details: { replayId: row.replayId, step: row.step },
  };
}

const SEE_BOOKMARKS = 'see its bookmarks';

export function createBookmarksService({ db, audit }: { db: Database; audit: AuditService }) {
  async function withPeople(rows: BookmarkRow[]): Promise<TBookmark[]> {
    const people = await loadPeople(
      db,
      rows.map((row) => row.authorId),
    );
    return rows.map((row) => toBookmark(row, people));
  }

  async function loadRow(bookmarkId: string, executor: Database = db): Promise<BookmarkRow> {
    const [row] = await executor.select().from(bookmarks).where(eq(bookmarks.id, bookmarkId));
    if (!row) throw new AppError('not_found', `No bookmark with id ${bookmarkId}.`);
    return row;
  }

  /** The replay must be a finished run of one of this case's bundles, and the step inside it. */
  async function loadPinnableReplay(tx: Transaction, caseId: string, request: TCreateBookmarkRequest) {
    const [replay] = await tx
      .select({
        bundleId: replays.bundleId,
        caseId: bundles.caseId,
        label: replays.label,
        digest: replays.digest,
        steps: replays.steps,
        status: replays.status,
      })
      .from(replays)
      .innerJoin(bundles, eq(bundles.id, replays.bundleId))
      .where(eq(replays.id, request.replayId));
    if (!replay || replay.caseId !== caseId)
      throw invalid('replayId', `No replay ${request.replayId} in this case`);
    if (replay.status !== 'done' || !replay.digest || replay.steps === null) {
      throw invalid(
        'replayId',
        `Replay ${request.replayId} is ${REPLAY_STATUS_LABELS[replay.status].toLowerCase()}; pin a finished replay`,
      );
    }
    if (request.step >= replay.steps) {
      throw invalid('step', `Step ${request.step} is outside the replay (steps 0 to ${replay.steps - 1})`);
    }
    return { ...replay, digest: replay.digest };
  }

  async function createBookmark(caseId: string, request: TCreateBookmarkRequest, actor: Actor) {
    const row = await db.transaction(async (tx) => {
      await assertCaseMember(tx, caseId, actor, 'pin moments on it');
      const replay = await loadPinnableReplay(tx, caseId, request);
      const [inserted] = await tx
        .insert(bookmarks)
        .values({
          id: randomUUID(),
          caseId,
          bundleId: replay.bundleId,
          replayId: request.replayId,
          replayLabel: replay.label,
          replayDigest: replay.digest,
          step: request.step,
          t: request.t,
          view: request.view,
          note: request.note,
          authorId: actor.id,
        })
        .returning();
      await audit.append(tx, {
        actor,
        action: 'bookmark.create',
        ...bookmarkEntry(inserted),
        payload: request,
      });
      return inserted;
    });
    return (await withPeople([row]))[0];
  }

  async function listBookmarks(caseId: string, actor: Actor): Promise<TBookmark[]> {
    await assertCaseMember(db, caseId, actor, SEE_BOOKMARKS);
    return readBookmarks(caseId);
  }

  /** The case's bookmarks, unchecked: for the archive export, which checks membership once. */
  async function readBookmarks(caseId: string): Promise<TBookmark[]> {
    await loadCaseState(db, caseId);
    return withPeople(
      await db.select().from(bookmarks).where(eq(bookmarks.caseId, caseId)).orderBy(asc(bookmarks.createdAt)),
    );
  }

  async function getBookmark(bookmarkId: string, actor: Actor): Promise<TBookmark> {
    await assertMemberOfCaseOf(db, 'bookmark', bookmarkId, actor, SEE_BOOKMARKS);
    return (await withPeople([await loadRow(bookmarkId)]))[0];
  }

  async function updateNote(bookmarkId: string, request: TUpdateBookmarkRequest, actor: Actor) {
    const row = await db.transaction(async (tx) => {
      const existing = await loadRow(bookmarkId, tx);
      await assertCaseMember(tx, existing.caseId, actor, 'edit its bookmarks');
      if (existing.authorId !== actor.id && actor.role !== 'admin') {
        throw new AppError('forbidden', 'Only the bookmark author or an admin can edit its note.');
      }
      await assertNotHeld(tx, existing.caseId, `Editing the note of bookmark ${bookmarkId}`);
      const [updated] = await tx
        .update(bookmarks)
        .set({ note: request.note, updatedAt: new Date() })
        .where(eq(bookmarks.id, bookmarkId))
        .returning();
      await audit.append(tx, {
        actor,
        action: 'bookmark.edit_note',
        ...bookmarkEntry(updated),
        payload: { note: request.note },
      });
      return updated;
    });
    return (await withPeople([row]))[0];
  }

  async function deleteBookmark(bookmarkId: string, actor: Actor): Promise<TBookmark> {
    const row = await db.transaction(async (tx) => {
      const existing = await loadRow(bookmarkId, tx);
      await assertCaseMember(tx, existing.caseId, actor, 'delete its bookmarks');
      if (existing.authorId !== actor.id) {
        throw new AppError('forbidden', 'Only the bookmark author can delete it.');
      }
      await assertNotHeld(tx, existing.caseId, `Deleting bookmark ${bookmarkId}`);
      const citing = await findVersionsCitingBookmark(tx, existing.caseId, bookmarkId);
      if (citing.length) {
        throw new AppError(
          'conflict',
          `Bookmark ${bookmarkId} is cited by findings version ${citing.join(', ')}; a cited bookmark is kept.`,
          { versions: citing },
        );
      }
      await tx.delete(bookmarks).where(eq(bookmarks.id, bookmarkId));
      await audit.append(tx, { actor, action: 'bookmark.delete', ...bookmarkEntry(existing) });
      return existing;
    });
    return (await withPeople([row]))[0];
  }

  return { createBookmark, listBookmarks, readBookmarks, getBookmark, updateNote, deleteBookmark };
}

export type BookmarksService = ReturnType<typeof createBookmarksService>;
