import type { RequestHandler } from 'express';
import multer from 'multer';
import { AppError } from '../../../shared/errors';

/**
 * multer for one file in `field`, streamed to `dest`. A body that is not well-formed
 * multipart/form-data (no boundary, a part cut short, a broken part header) is the client's
 * mistake and gets 400 naming the problem; multer's own limit errors go on to the error handler
 * (413 for a file over the limit). multer removes what it stored of a failed upload.
 */
export function singleFileUpload(options: {
  dest: string;
  field: string;
  maxBytes: number;
  maxFields: number;
}): RequestHandler {
  const upload = multer({
    dest: options.dest,
    limits: { fileSize: options.maxBytes, files: 1, fields: options.maxFields },
  }).single(options.field);
  return (req, res, next) => {
    upload(req, res, (error?: unknown) => {
      if (!error || error instanceof multer.MulterError || error instanceof AppError) return next(error);
      const reason = error instanceof Error ? error.message : String(error);
      next(
        new AppError(
          'bad_request',
          `The upload is not valid multipart/form-data (${reason}). Send the file in the form field "${options.field}".`,
          [{ path: options.field, field: options.field, message: reason }],
        ),
      );
    });
  };
}
