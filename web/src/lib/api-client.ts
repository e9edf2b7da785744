import { CSRF_COOKIE, CSRF_HEADER } from '@shared/contracts/auth';
import { type ErrorCode, type FieldIssue, isErrorBody } from '@shared/errors';
import type { ZodType } from 'zod';

/** Server error codes plus the two failures that happen before a server answer can be read. */
export type ApiErrorCode = ErrorCode | 'network_error' | 'unexpected_response';

/** Every failed API call becomes one of these; callers decide whether to show, retry or redirect. */
export class ApiError extends Error {
  readonly status: number;
  readonly code: ApiErrorCode;
  readonly details?: unknown;

  constructor(status: number, code: ApiErrorCode, message: string, details?: unknown) {
    super(message);
    this.name = 'ApiError';
    this.status = status;
    this.code = code;
    this.details = details;
  }

  /** The per-field problems of a 400 (`details: [{ path, message }]`); empty for other errors. */
  get fieldIssues(): FieldIssue[] {
    if (!Array.isArray(this.details)) return [];
    return this.details.filter(
      (item): item is FieldIssue =>
        typeof item === 'object' &&
        item !== null &&
        typeof item.path === 'string' &&
        typeof item.message === 'string',
    );
  }
}

export function isApiError(error: unknown): error is ApiError {
  return error instanceof ApiError;
}

/** Reads one cookie from a `document.cookie`-style string (`a=1; b=2`), per RFC 6265 section 4.2.1. */
export function readCookie(cookieString: string, name: string): string | undefined {
  for (const pair of cookieString.split(';')) {
    const separator = pair.indexOf('=');
    if (separator < 0) continue;
    if (pair.slice(0, separator).trim() === name) return decodeURIComponent(pair.slice(separator + 1).trim());
  }
  return undefined;
}

type Method = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';
type QueryValue = string | number | boolean | undefined | null;

export interface RequestOptions<T> {
  method?: Method;
  body?: unknown;
  query?: Record<string, QueryValue>;
  /** Checks the response shape, so a contract drift shows up as a clear error instead of a blank page. */
  schema?: ZodType<T>;
  signal?: AbortSignal;
}

function buildUrl(path: string, query?: Record<string, QueryValue>): string {
  if (!query) return path;
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(query)) {
    if (value !== undefined && value !== null && value !== '') params.set(key, String(value));
  }
  const search = params.toString();
  return search ? `${path}?${search}` : path;
}

function csrfHeaders(method: Method): Record<string, string> {
  if (method === 'GET' || typeof document === 'undefined') return {};
  const token = readCookie(document.cookie, CSRF_COOKIE);
  return token ? { [CSRF_HEADER]: token } : {};
}

async function readJson(response: Response): Promise<unknown> {
  const text = await response.text();
  if (!text) return undefined;
  try {
    return JSON.parse(text);
  } catch {
    throw new ApiError(
      response.status,
      'unexpected_response',
      `The server answered ${response.status} with something that is not JSON.`,
    );
  }
}

/**
 * The one fetch wrapper: sends cookies, adds the CSRF double-submit header on writes,
 * and turns `{ error: { code, message, details } }` into a thrown `ApiError`.
 */
export async function apiRequest<T = unknown>(path: string, options: RequestOptions<T> = {}): Promise<T> {
  const method = options.method ?? 'GET';
  const headers: Record<string, string> = { accept: 'application/json', ...csrfHeaders(method) };
  if (options.body !== undefined) headers['content-type'] = 'application/json';

  let response: Response;
  try {
    response = await fetch(buildUrl(path, options.query), {
      method,
      headers,
      credentials: 'same-origin',
      body: options.body === undefined ? undefined : JSON.stringify(options.body),
      signal: options.signal,
    });
  } catch (cause) {
    if (cause instanceof DOMException && cause.name === 'AbortError') throw cause;
    throw new ApiError(0, 'network_error', 'Cannot reach the Driftcase server. Check your connection.');
  }

  const payload = await readJson(response);
  if (!response.ok) {
    if (isErrorBody(payload)) {
      throw new ApiError(response.status, payload.error.code, payload.error.message, payload.error.details);
    }
    throw new ApiError(response.status, 'unexpected_response', `The server answered ${response.status}.`);
  }
  if (!options.schema) return payload as T;
  const parsed = options.schema.safeParse(payload);
  if (!parsed.success) {
    const where = parsed.error.issues[0]?.path.join('.') || '(root)';
    throw new ApiError(
      response.status,
      'unexpected_response',
      `The server's answer to ${method} ${path} has an unexpected shape at "${where}".`,
      parsed.error.issues,
    );
  }
  return parsed.data;
}
