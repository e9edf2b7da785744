import type { NextFunction, Request, RequestHandler, Response, Router } from 'express';
import type { AuditAction } from '../../../shared/audit-actions';
import { AppError } from '../../../shared/errors';
import type { Role } from '../../../shared/roles';
import type { SessionUser } from '../services/auth/session-user';

/** Who may call a route: `public` needs no session; otherwise a session whose role is listed. */
export type RouteAccess = 'public' | readonly Role[];

export interface AuthedRequest extends Request {
  user: SessionUser;
}

/**
 * The audit entry a successful call of a write route leaves. The service the handler calls
 * appends it inside the write's transaction (see DEVELOPERS.md, "Add a route"); the route only
 * names it, and the role-matrix test checks that each write route's call produces exactly this
 * entry (plus any `case.transition` it causes) and that a refused call produces none.
 */
export interface RouteAudit {
  action: AuditAction;
  /**
   * Entries the call commits on their own before its main one, e.g. an upload's `bundle.receive`
   * custody entry, written before the original is parsed so a failed parse never leaves it unrecorded.
   */
  precededBy?: readonly AuditAction[];
}

export interface RouteSpec {
  method: 'get' | 'post' | 'put' | 'patch' | 'delete';
  path: string;
  access: RouteAccess;
  /** Extra middleware run after the access check (e.g. multer for uploads). */
  before?: RequestHandler[];
  handler: (req: AuthedRequest, res: Response, next: NextFunction) => unknown;
  /** Required on every write route (non-GET). */
  audit?: RouteAudit;
}

/**
 * Mounts route specs on a router with their access check first, so every route states its roles
 * in one place and the role-matrix test can read the same list.
 */
export function mountRoutes(router: Router, specs: readonly RouteSpec[]): void {
  for (const spec of specs) {
    const guard: RequestHandler = (req, _res, next) => {
      if (spec.access === 'public') return next();
      const user = (req as Partial<AuthedRequest>).user;
      if (!user) return next(new AppError('unauthenticated', 'Sign in to continue.'));
      if (!spec.access.includes(user.role)) {
        return next(
          new AppError('forbidden', `This action needs one of these roles: ${spec.access.join(', ')}.`, {
            role: user.role,
            allowed: spec.access,
          }),
        );
      }
      next();
    };
    router[spec.method](spec.path, guard, ...(spec.before ?? []), spec.handler as unknown as RequestHandler);
  }
}
