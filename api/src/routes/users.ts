import { z } from 'zod';
import { ZCreateUserRequest, ZUpdateUserRequest } from '../../../shared/contracts/users';
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
      audit: { action: 'user.create' },
      handler: async (req, res) => {
        const body = ZCreateUserRequest.parse(req.body);
        res.status(201).json(await users.createUser(body, req.user));
      },
    },
    {
      method: 'patch',
      path: '/users/:id',
      access: ['admin'],
      audit: { action: 'user.update' },
      handler: async (req, res) => {
        const { id } = ZUserParams.parse(req.params);
        const body = ZUpdateUserRequest.parse(req.body);
        res.json(await users.updateUser(id, body, req.user));
      },
    },
  ];
}
