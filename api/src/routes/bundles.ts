import fs from 'node:fs';
import { z } from 'zod';
import { safeText, unsafeTextReason } from '../../../shared/contracts/safe-text';
import { AppError } from '../../../shared/errors';
import { ROLES } from '../../../shared/roles';
import type { RouteSpec } from '../http/route-spec';
import { sendStoredFile } from '../http/send-stored-file';
import { singleFileUpload } from '../http/single-file-upload';
import type { BundlesService } from '../services/bundles/bundles-service';
import { ZCaseParams } from './cases';

const ZBundleParams = z.object({ id: z.uuid('Bundle id must be a UUID') });
const ZReplayOfBundleParams = ZBundleParams.extend({ replayId: z.uuid('Replay id must be a UUID') });
const ZTableParams = ZBundleParams.extend({ name: safeText().min(1).max(40) });

export interface BundleRouteOptions {
  incomingDir: string;
  maxUploadBytes: number;
}

export function bundleRoutes(bundles: BundlesService, options: BundleRouteOptions): RouteSpec[] {
  // Streams the upload to disk under DATA_DIR; nothing is held whole in memory.
  const upload = singleFileUpload({
    dest: options.incomingDir,
    field: 'bundle',
    maxBytes: options.maxUploadBytes,
    maxFields: 10,
  });

  return [
    {
      method: 'post',
      path: '/cases/:id/bundles',
      access: ['investigator'],
      before: [upload],
      // A bundle that fails validation is still stored and audited; the answer is then 422.
      audit: { action: 'bundle.upload', precededBy: ['bundle.receive'] },
      handler: async (req, res) => {
        const { id: caseId } = ZCaseParams.parse(req.params);
        if (!req.file) {
          throw new AppError(
            'bad_request',
            'Attach the bundle as a .zip file in the multipart field "bundle".',
            [{ path: 'bundle', message: 'Required' }],
          );
        }
        const originalName = Buffer.from(req.file.originalname, 'latin1').toString('utf8');
        const nameProblem = unsafeTextReason(originalName);
        if (nameProblem) {
          await fs.promises.rm(req.file.path, { force: true });
          const message = `The file name ${nameProblem}; rename the file and upload it again`;
          throw new AppError('validation_failed', `Invalid request: bundle: ${message}.`, [
            { path: 'bundle', field: 'bundle', message },
          ]);
        }
        const outcome = await bundles.uploadBundle({
          caseId,
          tempFile: req.file.path,
          originalName,
          actor: req.user,
        });
        if (outcome.bundle.status === 'invalid') {
          const errors = outcome.bundle.issues.filter((issue) => issue.severity !== 'warning');
          res.status(422).json({
            error: {
              code: 'invalid_bundle',
              message: `The bundle was stored (SHA-256 ${outcome.bundle.sha256.slice(0, 12)}…) but is not valid: ${errors.length} problem(s) found.`,
              details: { bundle: outcome.bundle, issues: errors, duplicate: outcome.isDuplicate },
            },
          });
          return;
        }
        res
          .status(outcome.isDuplicate ? 200 : 201)
          .json({ bundle: outcome.bundle, duplicate: outcome.isDuplicate });
      },
    },
    {
      method: 'get',
      path: '/cases/:id/bundles',
      access: ROLES,
      handler: async (req, res) => {
        const { id } = ZCaseParams.parse(req.params);
        res.json({ items: await bundles.listCaseBundles(id, req.user) });
      },
    },
    {
      method: 'get',
      path: '/bundles/:id',
      access: ROLES,
      handler: async (req, res) => {
        const { id } = ZBundleParams.parse(req.params);
        res.json(await bundles.getBundle(id, req.user));
      },
    },
    {
      method: 'get',
      path: '/bundles/:id/tables/:name',
      access: ROLES,
      handler: async (req, res) => {
        const { id, name } = ZTableParams.parse(req.params);
        const file = await bundles.tableFile(id, name, req.user);
        await sendStoredFile(res, file, {
          what: `table ${name} of bundle ${id}`,
          headers: {
            'Content-Type': 'application/vnd.apache.arrow.stream',
            'Cache-Control': 'private, max-age=3600',
          },
        });
      },
    },
    {
      method: 'get',
      path: '/bundles/:id/original',
      access: ROLES,
      handler: async (req, res) => {
        const { id } = ZBundleParams.parse(req.params);
        const original = await bundles.originalFile(id, req.user);
        res.download(original.path, original.name);
      },
    },
    {
      method: 'get',
      path: '/bundles/:id/map',
      access: ROLES,
      handler: async (req, res) => {
        const { id } = ZBundleParams.parse(req.params);
        res.setHeader('Cache-Control', 'private, max-age=3600');
        res.json(await bundles.bundleMap(id, req.user));
      },
    },
    {
      method: 'get',
      path: '/bundles/:id/tracks',
      access: ROLES,
      handler: async (req, res) => {
        const { id } = ZBundleParams.parse(req.params);
        res.setHeader('Cache-Control', 'private, max-age=3600');
        res.json(await bundles.bundleTracks(id, req.user));
      },
    },
    {
      method: 'get',
      path: '/bundles/:id/replays/:replayId/clearance',
      access: ROLES,
      handler: async (req, res) => {
        const { id, replayId } = ZReplayOfBundleParams.parse(req.params);
        res.json(await bundles.replayClearance(id, replayId, req.user));
      },
    },
  ];
}
