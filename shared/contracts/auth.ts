import { z } from 'zod';
import { ROLES } from '../roles';
import { safeText } from './safe-text';

export const ZRole = z.enum(ROLES);

export const ZLoginRequest = z.strictObject({
  email: safeText().trim().toLowerCase().email('Enter a valid e-mail address'),
  password: safeText().min(1, 'Enter your password').max(200),
});
export type TLoginRequest = z.infer<typeof ZLoginRequest>;

export const ZSessionUser = z.object({
  id: z.string(),
  email: z.string(),
  name: z.string(),
  role: ZRole,
});
export type TSessionUser = z.infer<typeof ZSessionUser>;

/** The login response: the token is also set as an httpOnly cookie; scripts send it as a Bearer token. */
export const ZLoginResponse = z.object({ user: ZSessionUser, token: z.string(), csrfToken: z.string() });
export type TLoginResponse = z.infer<typeof ZLoginResponse>;

export const ZMeResponse = z.object({ user: ZSessionUser, csrfToken: z.string().optional() });
export type TMeResponse = z.infer<typeof ZMeResponse>;

/** Name of the cookie holding the session token, and of the CSRF double-submit cookie and header. */
export const SESSION_COOKIE = 'driftcase_session';
export const CSRF_COOKIE = 'driftcase_csrf';
export const CSRF_HEADER = 'x-csrf-token';
