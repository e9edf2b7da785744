import { randomUUID } from 'node:crypto';
import { asc, eq } from 'drizzle-orm';
import type {
  TBookmark,
  TCreateBookmarkRequest,
  TUpdateBookmarkRequest,
} from '../../../../shared/contracts/bookmarks';
import { AppError } from '../../../../shared/errors';
import type { Role } from '../../../../shared/roles';
import type { Database } from '../../db/client';
import { type BookmarkRow, bookmarks, bundles, replays } from '../../db/schema';
import { loadPeople } from '../findings/people';
import type { HoldsService } from '../holds/holds-service';
import { loadCaseState } from '../lifecycle/case-state';
import { toBookmark } from './bookmark-mapper';
import { findVersionsCitingBookmark } from './cited-by-findings';

interface Actor {
  id: string;
  role: Role;
}

function invalid(path: string, message: string): AppError {
  return new AppError('validation_failed', `${path}: ${message}.`, [{ path, message }]);
}

/** Pinned replay moments of a case; findings cite them as evidence. */
export function createBookmarksService({ db, holds }: { db: Database; holds: HoldsService }) {
  async function withPeople(rows: BookmarkRow[]): Promise<TBookmark[]> {
    const people = await loadPeople(
      db,
      rows.map((row) => row.authorId),
    );
    return rows.map((row) => toBookmark(row, people));
  }

  async function loadRow(bookmarkId: string): Promise<BookmarkRow> {
    const [row] = await db.select().from(bookmarks).where(eq(bookmarks.id, bookmarkId));
    if (!row) throw new AppError('not_found', `No bookmark with id ${bookmarkId}.`);
    return row;
  }

  /** The replay must be a finished run of one of this case's bundles, and the step inside it. */
  async function loadPinnableReplay(caseId: string, request: TCreateBookmarkRequest) {
    const [replay] = await db
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
      throw invalid('replayId', `Replay ${request.replayId} is ${replay.status}; pin a finished replay`);
    }
    if (request.step >= replay.steps) {
      throw invalid('step', `Step ${request.step} is outside the replay (steps 0 to ${replay.steps - 1})`);
    }
    return { ...replay, digest: replay.digest };
  }

  async function createBookmark(caseId: string, request: TCreateBookmarkRequest, actor: Actor) {
    await loadCaseState(db, caseId);
    const replay = await loadPinnableReplay(caseId, request);
    const [row] = await db
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
    return (await withPeople([row]))[0];
  }

  async function listBookmarks(caseId: string): Promise<TBookmark[]> {
    await loadCaseState(db, caseId);
    return withPeople(
      await db.select().from(bookmarks).where(eq(bookmarks.caseId, caseId)).orderBy(asc(bookmarks.createdAt)),
    );
  }

  async function getBookmark(bookmarkId: string): Promise<TBookmark> {
    return (await withPeople([await loadRow(bookmarkId)]))[0];
  }

  async function updateNote(bookmarkId: string, request: TUpdateBookmarkRequest, actor: Actor) {
    const existing = await loadRow(bookmarkId);
    if (existing.authorId !== actor.id && actor.role !== 'admin') {
      throw new AppError('forbidden', 'Only the bookmark author or an admin can edit its note.');
    }
    const [row] = await db
      .update(bookmarks)
      .set({ note: request.note, updatedAt: new Date() })
      .where(eq(bookmarks.id, bookmarkId))
      .returning();
    return (await withPeople([row]))[0];
  }

  async function deleteBookmark(bookmarkId: string, actor: Actor): Promise<TBookmark> {
    const existing = await loadRow(bookmarkId);
    if (existing.authorId !== actor.id) {
      throw new AppError('forbidden', 'Only the bookmark author can delete it.');
    }
    await holds.assertNotHeld(existing.caseId, `Deleting bookmark ${bookmarkId}`);
    const citing = await findVersionsCitingBookmark(db, existing.caseId, bookmarkId);
    if (citing.length) {
      throw new AppError(
        'conflict',
        `Bookmark ${bookmarkId} is cited by findings version ${citing.join(', ')}; a cited bookmark is kept.`,
        { versions: citing },
      );
    }
    await db.delete(bookmarks).where(eq(bookmarks.id, bookmarkId));
    return (await withPeople([existing]))[0];
  }

  return { createBookmark, listBookmarks, getBookmark, updateNote, deleteBookmark };
}

export type BookmarksService = ReturnType<typeof createBookmarksService>;
