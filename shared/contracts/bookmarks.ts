import { z } from 'zod';
import { safeText } from './safe-text';

/** The map view a bookmark restores: centre in the map frame (m), zoom in screen px per m. */
export const ZBookmarkView = z.strictObject({
  centerX: z.number().finite('centerX must be a finite number (m)'),
  centerY: z.number().finite('centerY must be a finite number (m)'),
  zoom: z.number().positive('zoom must be above 0 (px per m)').max(1e6),
  followRobot: z.boolean().optional(),
  /** Names of the visible map layers, e.g. "particles", "scan", "heatmap". */
  layers: z.array(safeText().min(1).max(60)).max(40).optional(),
});
export type TBookmarkView = z.infer<typeof ZBookmarkView>;

const ZNote = safeText().trim().min(1, 'Write a note for the bookmark').max(4000);

/** Body of `POST /api/cases/:id/bookmarks`. */
export const ZCreateBookmarkRequest = z.strictObject({
  replayId: z.uuid('replayId must be a replay id (UUID)'),
  step: z.number().int('step must be a whole step number').nonnegative('step must be 0 or more'),
  /** s since the bundle's start_time */
  t: z.number().finite('t must be a finite time (s)'),
  view: ZBookmarkView,
  note: ZNote,
});
export type TCreateBookmarkRequest = z.infer<typeof ZCreateBookmarkRequest>;

/** Body of `PATCH /api/bookmarks/:id`: only the note changes; the moment stays as pinned. */
export const ZUpdateBookmarkRequest = z.strictObject({ note: ZNote });
export type TUpdateBookmarkRequest = z.infer<typeof ZUpdateBookmarkRequest>;

export const ZBookmark = z.object({
  id: z.string(),
  caseId: z.string(),
  bundleId: z.string(),
  replayId: z.string(),
  replayLabel: z.string(),
  /** The replay's digest when the bookmark was made, so the citation can be verified. */
  replayDigest: z.string(),
  step: z.number().int(),
  t: z.number(),
  view: ZBookmarkView,
  note: z.string(),
  author: z.object({ id: z.string(), name: z.string() }),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type TBookmark = z.infer<typeof ZBookmark>;

export const ZBookmarkList = z.object({ items: z.array(ZBookmark) });
export type TBookmarkList = z.infer<typeof ZBookmarkList>;
