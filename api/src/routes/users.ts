import { z } from 'zod';
import { ZCreateUserRequest, ZUpdateUserRequest } from '../../../shared/contracts/users';
import { bodyField, routeParam } from '../http/audit-facts';
import type { RouteSpec } from '../http/route-spec';
import type { UsersService } from '../services/users/users-service';

const ZUserParams = z.object({ id: z.uuid('User id must be a UUID') });

export function userRoutes(users: UsersService): RouteSpec[] {
  return [
    {
      method: 'get',
      path: '/users',
      access: ['admin'],
      handler: async (_req, res) => {
        res.json({ items: await users.listUsers() });
      },
    },
    {
      method: 'post',
      path: '/users',
      access: ['admin'],
      audit: {
        action: 'user.create',
        facts: (_req, body) => ({
          targetType: 'user',
          targetId: bodyField(body, 'id'),
          details: { role: bodyField(body, 'role') },
        }),
      },
      handler: async (req, res) => {
        const body = ZCreateUserRequest.parse(req.body);
        res.status(201).json(await users.createUser(body));
      },
    },
    {
      method: 'patch',
      path: '/users/:id',
      access: ['admin'],
      audit: {
        action: 'user.update',
        facts: (req) => ({
          targetType: 'user',
          targetId: routeParam(req, 'id'),
          details: { fields: Object.keys(req.body ?? {}) },
        }),
      },
      handler: async (req, res) => {
        const { id } = ZUserParams.parse(req.params);
        const body = ZUpdateUserRequest.parse(req.body);
        res.json(await users.updateUser(id, req.user.id, body));
      },
    },
  ];
}
