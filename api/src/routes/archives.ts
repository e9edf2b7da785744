import { AppError } from '../../../shared/errors';
import type { RouteSpec } from '../http/route-spec';
import { singleFileUpload } from '../http/single-file-upload';
import type { ArchiveService } from '../services/archive/archive-service';
import { ZCaseParams } from './cases';

export interface ArchiveRouteOptions {
  incomingDir: string;
  maxUploadBytes: number;
}

export function archiveRoutes(archives: ArchiveService, options: ArchiveRouteOptions): RouteSpec[] {
  // Streamed to disk under DATA_DIR: an archive can be as large as its evidence.
  const upload = singleFileUpload({
    dest: options.incomingDir,
    field: 'archive',
    maxBytes: options.maxUploadBytes,
    maxFields: 5,
  });

  return [
    {
      method: 'get',
      path: '/cases/:id/archive',
      access: ['legal'],
      // A read that leaves a custody record: the export appends it before the last byte is sent.
      audit: { action: 'archive.export' },
      handler: async (req, res) => {
        const { id } = ZCaseParams.parse(req.params);
        // Custody is appended by the export itself once the last byte is written (see archive-service).
        const prepared = await archives.prepareExport(id, {
          id: req.user.id,
          email: req.user.email,
          role: req.user.role,
        });
        res.attachment(prepared.fileName);
        res.type('application/zip');
        res.setHeader('Cache-Control', 'no-store');
        try {
          await prepared.writeTo(res);
          res.end();
        } catch (error) {
          req.log?.error({ err: error, caseId: id }, 'archive export failed');
          // Headers are gone; breaking the connection is the only honest signal left.
          res.destroy(error as Error);
        }
      },
    },
    {
      method: 'get',
      path: '/cases/:id/archives',
      access: ['legal', 'reviewer', 'admin'],
      handler: async (req, res) => {
        res.json({ items: await archives.listExports(ZCaseParams.parse(req.params).id, req.user) });
      },
    },
    {
      method: 'post',
      path: '/archives/verify',
      access: ['legal', 'reviewer', 'admin'],
      before: [upload],
      audit: { action: 'archive.verify' },
      handler: async (req, res) => {
        if (!req.file) {
          throw new AppError(
            'bad_request',
            'Attach the archive as a .zip file in the multipart field "archive".',
            [{ path: 'archive', message: 'Required' }],
          );
        }
        res.json(await archives.verifyUploadedArchive(req.file.path, req.user));
      },
    },
  ];
}
