import { z } from 'zod';
import { ZCreateBookmarkRequest, ZUpdateBookmarkRequest } from '../../../shared/contracts/bookmarks';
import { parseEmptyBody } from '../../../shared/contracts/empty-body';
import { ROLES } from '../../../shared/roles';
import type { RouteSpec } from '../http/route-spec';
import type { BookmarksService } from '../services/bookmarks/bookmarks-service';
import { ZCaseParams } from './cases';

const ZBookmarkParams = z.object({ id: z.uuid('Bookmark id must be a UUID') });

export function bookmarkRoutes(bookmarks: BookmarksService): RouteSpec[] {
  return [
    {
      method: 'get',
      path: '/cases/:id/bookmarks',
      access: ROLES,
      handler: async (req, res) => {
        res.json({ items: await bookmarks.listBookmarks(ZCaseParams.parse(req.params).id, req.user) });
      },
    },
    {
      method: 'post',
      path: '/cases/:id/bookmarks',
      access: ['investigator'],
      audit: { action: 'bookmark.create' },
      handler: async (req, res) => {
        const { id } = ZCaseParams.parse(req.params);
        const body = ZCreateBookmarkRequest.parse(req.body);
        res.status(201).json(await bookmarks.createBookmark(id, body, req.user));
      },
    },
    {
      method: 'get',
      path: '/bookmarks/:id',
      access: ROLES,
      handler: async (req, res) => {
        res.json(await bookmarks.getBookmark(ZBookmarkParams.parse(req.params).id, req.user));
      },
    },
    {
      method: 'patch',
      path: '/bookmarks/:id',
      // The service narrows this to the author (or an admin).
      access: ['investigator', 'admin'],
      audit: { action: 'bookmark.edit_note' },
      handler: async (req, res) => {
        const { id } = ZBookmarkParams.parse(req.params);
        res.json(await bookmarks.updateNote(id, ZUpdateBookmarkRequest.parse(req.body), req.user));
      },
    },
    {
      method: 'delete',
      path: '/bookmarks/:id',
      access: ['investigator'],
      audit: { action: 'bookmark.delete' },
      handler: async (req, res) => {
        const { id } = ZBookmarkParams.parse(req.params);
        parseEmptyBody(req.body);
        res.json(await bookmarks.deleteBookmark(id, req.user));
      },
    },
  ];
}
