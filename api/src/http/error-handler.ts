import type { ErrorRequestHandler } from 'express';
import multer from 'multer';
import { ZodError } from 'zod';
import { AppError, type ErrorBody, type FieldIssue } from '../../../shared/errors';

/** Turns zod issues into `{ path, message }` pairs a form can show beside its fields. */
export function toFieldIssues(error: ZodError): FieldIssue[] {
  return error.issues.map((issue) => ({
    path: issue.path.map(String).join('.') || '(body)',
    message: issue.message,
  }));
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
    body = { error: { code: error.code, message: error.message, details: error.details } };
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
