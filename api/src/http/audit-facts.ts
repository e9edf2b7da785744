import type { AuthedRequest } from './route-spec';

/** A string at `path` inside a JSON body, or null: audit facts read ids from what a handler sent. */
export function bodyField(body: unknown, ...path: string[]): string | null {
  let value: unknown = body;
  for (const key of path) value = (value as Record<string, unknown> | undefined)?.[key];
  return typeof value === 'string' ? value : null;
}

/** A route parameter, or null. */
export function routeParam(req: AuthedRequest, name: string): string | null {
  return (req.params as Record<string, string>)[name] ?? null;
}
