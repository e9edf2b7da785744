/**
 * Error codes shared by the API and the web client, and the one table that maps them to HTTP statuses.
 * Services throw `AppError`; the API's error middleware turns it into `{ error: { code, message, details } }`.
 */
export const ERROR_STATUS = {
  validation_failed: 400,
  bad_request: 400,
  unauthenticated: 401,
  invalid_credentials: 401,
  forbidden: 403,
  csrf_failed: 403,
  not_found: 404,
  conflict: 409,
  illegal_transition: 409,
  on_hold: 409,
  payload_too_large: 413,
  unsupported_media_type: 415,
  invalid_bundle: 422,
  /** A robot recording that could not be read into a bundle (the originals stay stored). */
  invalid_recording: 422,
  too_many_requests: 429,
  internal: 500,
  /** The audit entry of a write could not be stored, so the write was rolled back with it. */
  audit_failed: 500,
} as const;

export type ErrorCode = keyof typeof ERROR_STATUS;

/** One problem with a request field, named by its path (e.g. `incidentTime` or `items.2.owner`). */
export interface FieldIssue {
  path: string;
  message: string;
  /** The same name as `path`, for clients that read `field`. */
  field?: string;
}

export interface ErrorBody {
  error: { code: ErrorCode; message: string; details?: unknown };
}

export class AppError extends Error {
  readonly code: ErrorCode;
  readonly details?: unknown;

  /** `cause` is logged by the server and never sent to the client. */
  constructor(code: ErrorCode, message: string, details?: unknown, options?: { cause?: unknown }) {
    super(message, options);
    this.name = 'AppError';
    this.code = code;
    this.details = details;
  }

  get status(): number {
    return ERROR_STATUS[this.code];
  }
}

export function isErrorBody(value: unknown): value is ErrorBody {
  return (
    typeof value === 'object' &&
    value !== null &&
    'error' in value &&
    typeof (value as ErrorBody).error?.code === 'string'
  );
}
