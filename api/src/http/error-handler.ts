import type { ErrorRequestHandler } from 'express';
import multer from 'multer';
import { ZodError, type z } from 'zod';
import { printableText } from '../../../shared/contracts/safe-text';
import { AppError, type ErrorBody, type FieldIssue } from '../../../shared/errors';

/** A field path as people write it (`items.2.owner`), with unprintable characters escaped. */
function fieldName(path: readonly PropertyKey[]): string {
  return path.map((part) => printableText(String(part))).join('.') || '(body)';
}

function fieldIssue(path: readonly PropertyKey[], message: string): FieldIssue {
  const name = fieldName(path);
  return { path: name, field: name, message };
}

/** Whether a union option failed only because the value has another type (so it is not the one meant). */
const isWrongType = (issues: readonly z.core.$ZodIssue[]) =>
  issues.every((issue) => issue.code === 'invalid_type' && issue.path.length === 0);

function issuesToFields(issues: readonly z.core.$ZodIssue[], prefix: readonly PropertyKey[]): FieldIssue[] {
  return issues.flatMap((issue) => {
    const path = [...prefix, ...issue.path];
    if (issue.code === 'unrecognized_keys') {
      return issue.keys.map((key) =>
        fieldIssue([...path, key], 'Unknown field: this request does not accept it; remove it'),
      );
    }
    if (issue.code === 'invalid_key') {
      const reason = issue.issues.map((inner) => inner.message).join('; ');
      return [fieldIssue(path, `This field name is not accepted${reason ? `: ${reason}` : ''}`)];
    }
    if (issue.code === 'invalid_union') {
      // The option of the value's own type explains the problem better than "Invalid input".
      const meant = issue.errors.filter((option) => !isWrongType(option));
      if (meant.length === 1) return issuesToFields(meant[0], path);
    }
    return [fieldIssue(path, issue.message)];
  });
}

/** Turns zod issues into `{ path, field, message }` triples a form can show beside its fields. */
export function toFieldIssues(error: ZodError): FieldIssue[] {
  return issuesToFields(error.issues, []);
}

/**
 * The one place errors become HTTP responses. Known errors keep their message; anything else is
 * logged with its stack and answered with a generic message, so no stack trace reaches a client.
 */
export const errorHandler: ErrorRequestHandler = (error, req, res, _next) => {
  let body: ErrorBody;
  let status: number;
  if (error instanceof AppError) {
    status = error.status;
    if (status >= 500) req.log?.error({ err: error, cause: error.cause }, error.message);
    body = { error: { code: error.code, message: error.message, details: error.details } };
    const retryAfter = (error.details as { retryAfterSeconds?: unknown } | undefined)?.retryAfterSeconds;
    if (status === 429 && typeof retryAfter === 'number' && !res.headersSent) {
      res.set('Retry-After', String(retryAfter));
    }
  } else if (error instanceof ZodError) {
    status = 400;
    const details = toFieldIssues(error);
    const summary = details.map((d) => `${d.path}: ${d.message}`).join('; ');
    body = { error: { code: 'validation_failed', message: `Invalid request: ${summary}`, details } };
  } else if (error instanceof multer.MulterError) {
    status = error.code === 'LIMIT_FILE_SIZE' ? 413 : 400;
    body = {
      error: {
        code: status === 413 ? 'payload_too_large' : 'bad_request',
        message:
          error.code === 'LIMIT_FILE_SIZE' ? 'The file is larger than the upload limit.' : error.message,
        details: { field: error.field },
      },
    };
  } else if (error?.type === 'entity.parse.failed') {
    status = 400;
    body = { error: { code: 'bad_request', message: 'The request body is not valid JSON.' } };
  } else if (error?.type === 'entity.too.large') {
    status = 413;
    body = { error: { code: 'payload_too_large', message: 'The request body is too large.' } };
  } else {
    status = 500;
    req.log?.error({ err: error }, 'unhandled error');
    body = {
      error: { code: 'internal', message: 'Something went wrong on the server. The error was logged.' },
    };
  }
  if (res.headersSent) return;
  res.status(status).json(body);
};
