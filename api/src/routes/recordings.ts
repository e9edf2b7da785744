import fs from 'node:fs';
import multer from 'multer';
import { z } from 'zod';
import { safeText, unsafeTextReason } from '../../../shared/contracts/safe-text';
import { AppError } from '../../../shared/errors';
import type { RouteSpec } from '../http/route-spec';
import type { RecordingFileRole, RecordingsService } from '../services/recordings/recordings-service';
import { ZCaseParams } from './cases';

const FILE_FIELDS: RecordingFileRole[] = ['recording', 'map', 'map_image', 'params', 'robot'];
const time = safeText().trim().max(40).optional();
const ZRecordingFields = z.strictObject({
  from: time,
  to: time,
  incident: time,
  progress_id: z.uuid('progress_id must be an id the page made (a UUID)').optional(),
});
const ZProgressParams = ZCaseParams.extend({ progressId: z.uuid('The progress id must be a UUID') });

/**
 * POST /cases/:id/recordings: a robot recording (and its map, parameter, robot files) becomes a
 * bundle. GET /cases/:id/recordings/progress/:progressId: how far the uploader's recording got.
 */
export function recordingRoutes(
  recordings: RecordingsService,
  options: { incomingDir: string; maxUploadBytes: number },
): RouteSpec[] {
  // Streams each file to disk under DATA_DIR; a multi-gigabyte recording is never held in memory.
  const upload = multer({
    dest: options.incomingDir,
    limits: { fileSize: options.maxUploadBytes, files: FILE_FIELDS.length, fields: 5 },
  }).fields(FILE_FIELDS.map((name) => ({ name, maxCount: 1 })));

  return [
    {
      method: 'post',
      path: '/cases/:id/recordings',
      access: ['investigator'],
      before: [upload],
      audit: { action: 'bundle.upload', precededBy: ['bundle.receive'] },
      handler: async (req, res) => {
        const { id: caseId } = ZCaseParams.parse(req.params);
        const uploaded = (req.files ?? {}) as Record<string, Express.Multer.File[]>;
        const files: Parameters<RecordingsService['importUpload']>[0]['files'] = {};
        const removeAll = () =>
          Promise.all(
            Object.values(uploaded)
              .flat()
              .map((file) => fs.promises.rm(file.path, { force: true })),
          );
        for (const role of FILE_FIELDS) {
          const file = uploaded[role]?.[0];
          if (!file) continue;
          const originalName = Buffer.from(file.originalname, 'latin1').toString('utf8');
          const problem = unsafeTextReason(originalName);
          if (problem) {
            await removeAll();
            const message = `The file name ${problem}; rename the file and upload it again`;
            throw new AppError('validation_failed', `Invalid request: ${role}: ${message}.`, [
              { path: role, field: role, message },
            ]);
          }
          files[role] = { tempFile: file.path, originalName };
        }
        let fields: z.infer<typeof ZRecordingFields>;
        try {
          fields = ZRecordingFields.parse(req.body ?? {});
        } catch (error) {
          await removeAll();
          throw error;
        }
        const { progress_id: progressId, ...times } = fields;
        const outcome = await recordings.importUpload({
          caseId,
          actor: req.user,
          files,
          progressId,
          ...times,
        });
        const status = outcome.bundle.status === 'invalid' ? 422 : outcome.isDuplicate ? 200 : 201;
        res.status(status).json({ bundle: outcome.bundle, duplicate: outcome.isDuplicate });
      },
    },
    {
      method: 'get',
      path: '/cases/:id/recordings/progress/:progressId',
      access: ['investigator'],
      handler: async (req, res) => {
        const { id, progressId } = ZProgressParams.parse(req.params);
        res.json(await recordings.progressOf(id, req.user, progressId));
      },
    },
  ];
}
