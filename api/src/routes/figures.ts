import fs from 'node:fs';
import { z } from 'zod';
import { MAX_FIGURE_BYTES, ZFigureFields } from '../../../shared/contracts/figures';
import { AppError } from '../../../shared/errors';
import { ROLES } from '../../../shared/roles';
import type { RouteSpec } from '../http/route-spec';
import { sendStoredFile } from '../http/send-stored-file';
import { singleFileUpload } from '../http/single-file-upload';
import type { FiguresService } from '../services/figures/figures-service';
import { ZCaseParams } from './cases';

const ZFigureParams = z.object({ id: z.uuid('Figure id must be a UUID') });

/**
 * Served pictures may never run anything, even an SVG opened on its own: no script, no requests,
 * a sandboxed origin, and the declared type only (defence in depth beside the upload's own check).
 */
const FIGURE_HEADERS = {
  'Content-Security-Policy': "default-src 'none'; img-src data:; style-src 'unsafe-inline'; sandbox",
  'X-Content-Type-Options': 'nosniff',
  'Cache-Control': 'private, max-age=3600',
};

export function figureRoutes(figures: FiguresService, options: { incomingDir: string }): RouteSpec[] {
  const upload = singleFileUpload({
    dest: options.incomingDir,
    field: 'figure',
    maxBytes: MAX_FIGURE_BYTES,
    maxFields: 3,
  });

  return [
    {
      method: 'post',
      path: '/cases/:id/figures',
      access: ['investigator'],
      before: [upload],
      audit: { action: 'figure.store' },
      handler: async (req, res) => {
        const { id: caseId } = ZCaseParams.parse(req.params);
        if (!req.file) {
          throw new AppError(
            'bad_request',
            'Attach the picture (PNG or SVG) in the multipart field "figure".',
            [{ path: 'figure', message: 'Required' }],
          );
        }
        const parsed = ZFigureFields.safeParse(req.body ?? {});
        if (!parsed.success) {
          await fs.promises.rm(req.file.path, { force: true });
          throw parsed.error;
        }
        const outcome = await figures.storeFigure({
          caseId,
          tempFile: req.file.path,
          fields: parsed.data,
          actor: req.user,
        });
        res.status(outcome.duplicate ? 200 : 201).json(outcome);
      },
    },
    {
      method: 'get',
      path: '/cases/:id/figures',
      access: ROLES,
      handler: async (req, res) => {
        const { id } = ZCaseParams.parse(req.params);
        res.json({ items: await figures.listFigures(id, req.user) });
      },
    },
    {
      method: 'get',
      path: '/figures/:id/file',
      access: ROLES,
      handler: async (req, res) => {
        const { id } = ZFigureParams.parse(req.params);
        const file = await figures.figureFile(id, req.user);
        await sendStoredFile(res, file.path, {
          what: `figure ${id}`,
          headers: {
            ...FIGURE_HEADERS,
            'Content-Type': file.mediaType,
            'Content-Disposition': `inline; filename="${file.fileName}"`,
          },
        });
      },
    },
  ];
}
