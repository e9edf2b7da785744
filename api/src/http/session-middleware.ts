import type { CookieOptions, RequestHandler, Response } from 'express';
import { CSRF_COOKIE, CSRF_HEADER, SESSION_COOKIE } from '../../../shared/contracts/auth';
import { AppError } from '../../../shared/errors';
import type { AuthService } from '../services/auth/auth-service';
import type { AuthedRequest } from './route-spec';

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

export interface SessionCookieOptions {
  secure: boolean;
  maxAgeSeconds: number;
}

export function setSessionCookies(
  res: Response,
  token: string,
  csrfToken: string,
  options: SessionCookieOptions,
) {
  const base: CookieOptions = {
    sameSite: 'strict',
    secure: options.secure,
    path: '/',
    maxAge: options.maxAgeSeconds * 1000,
  };
  res.cookie(SESSION_COOKIE, token, { ...base, httpOnly: true });
  // Readable by the page on purpose: the web client echoes it in the X-CSRF-Token header.
  res.cookie(CSRF_COOKIE, csrfToken, { ...base, httpOnly: false });
}

export function clearSessionCookies(res: Response) {
  res.clearCookie(SESSION_COOKIE, { path: '/' });
  res.clearCookie(CSRF_COOKIE, { path: '/' });
}

function bearerToken(header: string | undefined): string | undefined {
  const match = header?.match(/^Bearer\s+(\S+)$/i);
  return match?.[1];
}

/**
 * Identifies the caller from `Authorization: Bearer` or the session cookie. Cookie-authenticated
 * writes must echo the session's CSRF token in `X-CSRF-Token`; bearer tokens cannot be sent by
 * another site, so they need no such check.
 */
export function sessionMiddleware(auth: AuthService, cookies: SessionCookieOptions): RequestHandler {
  return async (req, res, next) => {
    const bearer = bearerToken(req.headers.authorization);
    const cookie = req.cookies?.[SESSION_COOKIE] as string | undefined;
    const token = bearer ?? cookie;
    if (!token) return next();
    const session = await auth.authenticate(token, bearer ? 'bearer' : 'cookie');
    if (!session) {
      if (!bearer) clearSessionCookies(res);
      return next();
    }
    if (session.user.via === 'cookie' && !SAFE_METHODS.has(req.method)) {
      if (req.get(CSRF_HEADER) !== session.csrfToken) {
        return next(
          new AppError('csrf_failed', 'Missing or wrong X-CSRF-Token header. Reload the page and try again.'),
        );
      }
    }
    (req as AuthedRequest).user = session.user;
    res.locals.csrfToken = session.csrfToken;
    if (session.rotatedToken) {
      if (session.user.via === 'cookie')
        setSessionCookies(res, session.rotatedToken, session.csrfToken, cookies);
      res.setHeader('X-Session-Token', session.rotatedToken);
    }
    next();
  };
}
