import type { NextFunction, Request, RequestHandler, Response, Router } from 'express';
import { AppError } from '../../../shared/errors';
import type { Role } from '../../../shared/roles';
import type { SessionUser } from '../services/auth/session-user';

/** Who may call a route: `public` needs no session; otherwise a session whose role is listed. */
export type RouteAccess = 'public' | readonly Role[];

export interface AuthedRequest extends Request {
  user: SessionUser;
}

export interface RouteSpec {
  method: 'get' | 'post' | 'put' | 'patch' | 'delete';
  path: string;
  access: RouteAccess;
  /** Extra middleware run after the access check (e.g. multer for uploads). */
  before?: RequestHandler[];
  handler: (req: AuthedRequest, res: Response, next: NextFunction) => unknown;
  /** Every write names its audit action; the role-matrix test checks that no write route lacks one. */
  audit?: AuditDeclaration;
}

/** What one successful call of a route did, for the audit trail. */
export interface AuditFacts {
  targetType: string;
  targetId?: string | null;
  /** Puts the entry in this case's chain; without it the entry joins the global chain. */
  caseId?: string | null;
  /** For calls made before a session exists (sign-in). */
  actor?: { id: string; email: string; role: string } | null;
  /** Small, human-readable facts for the case history (e.g. a status change). */
  details?: Record<string, unknown>;
}

export interface AuditDeclaration {
  action: string;
  /** Reads the facts from the request and the JSON the handler sent. */
  facts: (req: AuthedRequest, responseBody: unknown) => AuditFacts | Promise<AuditFacts>;
  /** Non-2xx statuses that still mean something was written (e.g. 422 for a stored but invalid bundle). */
  alsoOnStatuses?: readonly number[];
}

/** Records a route's audit entry before its response leaves. */
export type RouteAuditor = (spec: RouteSpec, req: AuthedRequest, responseBody: unknown) => Promise<void>;

/**
 * Holds the response until the audit entry is written, so a client that sees success can also
 * see the entry. A failed audit write is logged as an error; the write it describes already happened.
 */
function auditResponses(spec: RouteSpec, auditor: RouteAuditor): RequestHandler {
  const declaration = spec.audit as AuditDeclaration;
  return (req, res, next) => {
    let responseBody: unknown;
    let isRecorded = false;
    const sendJson = res.json.bind(res);
    res.json = (body: unknown) => {
      responseBody = body;
      return sendJson(body);
    };
    const end = res.end.bind(res) as (...args: unknown[]) => Response;
    res.end = ((...args: unknown[]) => {
      const isWrite =
        (res.statusCode >= 200 && res.statusCode < 300) ||
        declaration.alsoOnStatuses?.includes(res.statusCode);
      if (isRecorded || !isWrite) return end(...args);
      isRecorded = true;
      auditor(spec, req as AuthedRequest, responseBody).then(
        () => end(...args),
        (error: unknown) => {
          req.log?.error({ err: error, action: declaration.action }, 'audit entry could not be written');
          end(...args);
        },
      );
      return res;
    }) as Response['end'];
    next();
  };
}

/**
 * Mounts route specs on a router with their access check first, so every route states its roles
 * in one place and the role-matrix test can read the same list.
 */
export function mountRoutes(
  router: Router,
  specs: readonly RouteSpec[],
  options: { auditor?: RouteAuditor } = {},
): void {
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
    const audit = spec.audit && options.auditor ? [auditResponses(spec, options.auditor)] : [];
    router[spec.method](
      spec.path,
      guard,
      ...audit,
      ...(spec.before ?? []),
      spec.handler as unknown as RequestHandler,
    );
  }
}
