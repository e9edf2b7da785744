import { ZLoginRequest } from '../../../shared/contracts/auth';
import { parseEmptyBody } from '../../../shared/contracts/empty-body';
import { ROLES } from '../../../shared/roles';
import { clientAddress } from '../http/client-address';
import type { RouteSpec } from '../http/route-spec';
import {
  clearSessionCookies,
  type SessionCookieOptions,
  setSessionCookies,
} from '../http/session-middleware';
import type { AuthService } from '../services/auth/auth-service';

export function authRoutes(auth: AuthService, cookies: SessionCookieOptions): RouteSpec[] {
  return [
    {
      method: 'post',
      path: '/auth/login',
      access: 'public',
      audit: { action: 'auth.login' },
      handler: async (req, res) => {
        const body = ZLoginRequest.parse(req.body);
        const session = await auth.logIn(body, {
          address: clientAddress(req),
          userAgent: req.get('user-agent'),
        });
        setSessionCookies(res, session.token, session.csrfToken, cookies);
        res.json(session);
      },
    },
    {
      method: 'post',
      path: '/auth/logout',
      access: ROLES,
      audit: { action: 'auth.logout' },
      handler: async (req, res) => {
        parseEmptyBody(req.body);
        await auth.logOut(req.user);
        clearSessionCookies(res);
        res.status(204).end();
      },
    },
    {
      method: 'get',
      path: '/auth/me',
      access: ROLES,
      handler: (req, res) => {
        const { id, email, name, role } = req.user;
        res.json({ user: { id, email, name, role }, csrfToken: res.locals.csrfToken });
      },
    },
  ];
}
