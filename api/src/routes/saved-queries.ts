import { z } from 'zod';
import { ZCreateSavedQueryRequest } from '../../../shared/contracts/saved-queries';
import { ROLES } from '../../../shared/roles';
import type { RouteSpec } from '../http/route-spec';
import type { SavedQueriesService } from '../services/saved-queries/saved-queries-service';
import { ZCaseParams } from './cases';

const ZQueryParams = z.object({ id: z.uuid('Saved query id must be a UUID') });

export function savedQueryRoutes(queries: SavedQueriesService): RouteSpec[] {
  return [
    {
      method: 'get',
      path: '/cases/:id/queries',
      access: ROLES,
      handler: async (req, res) => {
        res.json({ items: await queries.listQueries(ZCaseParams.parse(req.params).id, req.user) });
      },
    },
    {
      method: 'post',
      path: '/cases/:id/queries',
      access: ['investigator'],
      audit: { action: 'saved_query.create' },
      handler: async (req, res) => {
        const { id } = ZCaseParams.parse(req.params);
        const body = ZCreateSavedQueryRequest.parse(req.body);
        res.status(201).json(await queries.saveQuery(id, body, req.user));
      },
    },
    {
      method: 'get',
      path: '/queries/:id',
      access: ROLES,
      handler: async (req, res) => {
        res.json(await queries.getQuery(ZQueryParams.parse(req.params).id, req.user));
      },
    },
  ];
}
