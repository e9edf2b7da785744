import type { AuthedRequest, RouteAuditor, RouteSpec } from '../../http/route-spec';
import type { AuditService } from './audit-service';

const SECRET_KEY = /password|token|secret/i;

/** Replaces secrets with a marker before hashing: a hash of a short password could be guessed back. */
function redactSecrets(value: unknown): unknown {
  if (Array.isArray(value)) return value.map(redactSecrets);
  if (value && typeof value === 'object') {
    return Object.fromEntries(
      Object.entries(value as Record<string, unknown>)
        .filter(([, v]) => v !== undefined)
        .map(([key, v]) => [key, SECRET_KEY.test(key) ? '[redacted]' : redactSecrets(v)]),
    );
  }
  return value;
}

/** The route auditor that `mountRoutes` calls: turns a route's declaration into an audit entry. */
export function createRouteAuditor(audit: AuditService): RouteAuditor {
  return async (spec: RouteSpec, req: AuthedRequest, responseBody: unknown) => {
    const declaration = spec.audit;
    if (!declaration) return;
    const facts = await declaration.facts(req, responseBody);
    const user = req.user as AuthedRequest['user'] | undefined;
    const actor = facts.actor ?? (user ? { id: user.id, email: user.email, role: user.role } : null);
    const file = req.file ? { name: req.file.originalname, size: req.file.size } : undefined;
    await audit.append({
      actor,
      action: declaration.action,
      targetType: facts.targetType,
      targetId: facts.targetId ?? null,
      caseId: facts.caseId ?? null,
      details: facts.details,
      payload: redactSecrets({
        method: spec.method,
        path: req.originalUrl.split('?')[0],
        body: req.body ?? null,
        file,
        status: req.res?.statusCode,
        response: responseBody ?? null,
      }),
    });
  };
}
