import type { AuditDeclaration, AuditFacts, AuthedRequest, RouteSpec } from '../../http/route-spec';

type Body = Record<string, unknown> | undefined;
const field = (body: unknown, ...path: string[]): string | null => {
  let value: unknown = body;
  for (const key of path) value = (value as Body)?.[key];
  return typeof value === 'string' ? value : null;
};
const param = (req: AuthedRequest, name: string) => (req.params as Record<string, string>)[name] ?? null;

/**
 * Audit declarations for write routes whose files predate the audit trail, keyed by
 * `method path`. A route that declares `audit` itself keeps its own.
 */
export const EXISTING_ROUTE_AUDITS: Record<string, AuditDeclaration> = {
  'post /auth/login': {
    action: 'auth.login',
    facts: (_req, body): AuditFacts => {
      const user = (body as { user?: { id: string; email: string; role: string } }).user;
      return {
        targetType: 'session',
        targetId: user?.id ?? null,
        actor: user ? { id: user.id, email: user.email, role: user.role } : null,
      };
    },
  },
  'post /auth/logout': {
    action: 'auth.logout',
    facts: (req) => ({ targetType: 'session', targetId: req.user.sessionId }),
  },
  'post /users': {
    action: 'user.create',
    facts: (_req, body) => ({
      targetType: 'user',
      targetId: field(body, 'id'),
      details: { role: field(body, 'role') },
    }),
  },
  'patch /users/:id': {
    action: 'user.update',
    facts: (req) => ({
      targetType: 'user',
      targetId: param(req, 'id'),
      details: { fields: Object.keys(req.body ?? {}) },
    }),
  },
  'post /cases': {
    action: 'case.create',
    facts: (_req, body) => ({ targetType: 'case', targetId: field(body, 'id'), caseId: field(body, 'id') }),
  },
  'patch /cases/:id': {
    action: 'case.update',
    facts: (req, body) => ({
      targetType: 'case',
      targetId: param(req, 'id'),
      caseId: param(req, 'id'),
      details: {
        fields: Object.keys(req.body ?? {}),
        ...(req.body?.status ? { status: field(body, 'status') } : {}),
      },
    }),
  },
  'post /cases/:id/bundles': {
    action: 'bundle.upload',
    // A bundle that fails validation is still stored (422), so that is a write too.
    alsoOnStatuses: [422],
    facts: (req, body) => {
      const bundle =
        (body as { bundle?: unknown; error?: { details?: { bundle?: unknown } } }).bundle ??
        (body as { error?: { details?: { bundle?: unknown } } }).error?.details?.bundle;
      return {
        targetType: 'bundle',
        targetId: field(bundle, 'id'),
        caseId: param(req, 'id'),
        details: { sha256: field(bundle, 'sha256'), status: field(bundle, 'status') },
      };
    },
  },
};

/** Adds declarations to the specs that have none; returns the same array for chaining. */
export function withAuditDeclarations(
  specs: RouteSpec[],
  declarations: Record<string, AuditDeclaration>,
): RouteSpec[] {
  for (const spec of specs) {
    spec.audit ??= declarations[`${spec.method} ${spec.path}`];
  }
  return specs;
}
