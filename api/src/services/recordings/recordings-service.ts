import fs from 'node:fs';
import path from 'node:path';
import { AppError } from '../../../../shared/errors';
import type { Database } from '../../db/client';
import { importRecording } from '../../recordings/import-recording';
import { RecordingError } from '../../recordings/recording-error';
import type { Actor } from '../actor';
import type { AuditService } from '../audit/audit-service';
import type { BundlesService, UploadOutcome } from '../bundles/bundles-service';
import type { EvidenceStore } from '../evidence/evidence-store';
import { assertCaseMember } from '../membership/case-access';
import type { ImportProgressBoard } from './import-progress';

export type RecordingFileRole = 'recording' | 'map' | 'map_image' | 'params' | 'robot';

export interface RecordingUpload {
  caseId: string;
  actor: Actor;
  files: Partial<Record<RecordingFileRole, { tempFile: string; originalName: string }>>;
  from?: string;
  to?: string;
  incident?: string;
  /** The client's id for polling how far the upload got (see import-progress.ts). */
  progressId?: string;
}

/**
 * A robot recording uploaded on the case page. Every original is moved into the evidence store
 * (content-addressed, read-only) before anything parses it; the importer then reads the stored
 * copies into a bundle zip, which is uploaded like any bundle and records the originals' hashes
 * in its manifest and its `bundle.upload` entry. If the recording cannot be read, the originals
 * stay stored and a `recording.import_failed` entry names them and the reason.
 */
export function createRecordingsService(deps: {
  db: Database;
  audit: AuditService;
  bundles: BundlesService;
  evidence: EvidenceStore;
  progress: ImportProgressBoard;
}) {
  const { db, audit, bundles, evidence, progress } = deps;

  async function importUpload(upload: RecordingUpload): Promise<UploadOutcome> {
    const id = upload.progressId;
    const report = (phase: Parameters<ImportProgressBoard['update']>[1], fraction: number) => {
      if (id) progress.update(id, phase, fraction);
    };
    if (id) progress.start(id, { caseId: upload.caseId, userId: upload.actor.id });
    try {
      const outcome = await importStoredUpload(upload, report);
      report('done', 1);
      return outcome;
    } catch (error) {
      report('failed', 0);
      throw error;
    }
  }

  /** How far the uploader's recording `progressId` has got, or a 404 naming what is missing. */
  async function progressOf(caseId: string, actor: Actor, progressId: string) {
    await assertCaseMember(db, caseId, actor, 'see its uploads');
    const found = progress.read(progressId, caseId, actor.id);
    if (!found) {
      throw new AppError(
        'not_found',
        'No recording upload of yours on this case has that progress id; it may have ended more than five minutes ago.',
      );
    }
    return found;
  }

  async function importStoredUpload(
    upload: RecordingUpload,
    report: (phase: 'storing' | 'reading' | 'writing' | 'checking', fraction: number) => void,
  ): Promise<UploadOutcome> {
    await assertCaseMember(db, upload.caseId, upload.actor, 'add evidence to it').catch(async (error) => {
      // A refused upload leaves nothing behind: the files were only ever in incoming/.
      await Promise.all(
        Object.values(upload.files).map((file) => fs.promises.rm(file.tempFile, { force: true })),
      );
      throw error;
    });
    const stored: { role: RecordingFileRole; name: string; sha256: string; path: string }[] = [];
    for (const [role, file] of Object.entries(upload.files) as [
      RecordingFileRole,
      { tempFile: string; originalName: string },
    ][]) {
      const kept = await evidence.storeUploadedFile(file.tempFile);
      report('storing', (stored.length + 1) / Object.keys(upload.files).length);
      stored.push({ role, name: file.originalName, sha256: kept.sha256, path: kept.path });
    }
    const recording = stored.find((file) => file.role === 'recording');
    if (!recording) {
      throw new AppError(
        'bad_request',
        'Attach the recording (.mcap, .bag or .db3) in the multipart field "recording".',
        [{ path: 'recording', message: 'Required' }],
      );
    }
    // The importer reads files by their names: give it read-only links named as uploaded.
    const work = await fs.promises.mkdtemp(path.join(evidence.incoming, 'recording-'));
    try {
      const linked: Partial<Record<RecordingFileRole, string>> = {};
      for (const file of stored) {
        let name = path.basename(file.name);
        if (file.role === 'map_image') name = await mapImageName(stored, name);
        const target = path.join(work, name);
        await fs.promises.symlink(file.path, target);
        linked[file.role] = target;
      }
      const out = path.join(work, `${path.parse(recording.name).name}-bundle.zip`);
      const displayNames = Object.fromEntries(stored.map((file) => [file.role, file.name]));
      try {
        await importRecording(
          {
            source: linked.recording as string,
            map: linked.map,
            params: linked.params,
            robot: linked.robot,
            from: upload.from,
            to: upload.to,
            incident: upload.incident,
            displayNames,
            out,
          },
          ({ phase, fraction }) => report(phase, fraction),
        );
      } catch (error) {
        const message =
          error instanceof RecordingError
            ? error.message
            : `the recording could not be read (${(error as Error).message})`;
        const originals = stored.map(({ role, name, sha256 }) => ({ role, name, sha256 }));
        await audit.appendAlone({
          actor: upload.actor,
          action: 'recording.import_failed',
          targetType: 'case',
          targetId: upload.caseId,
          caseId: upload.caseId,
          details: { originals, message: message.slice(0, 500) },
        });
        throw new AppError(
          'invalid_recording',
          `The originals were stored as evidence but could not be read: ${message}`,
          [{ path: 'recording', message }],
        );
      }
      report('checking', 0);
      return await bundles.uploadBundle({
        caseId: upload.caseId,
        tempFile: out,
        originalName: path.basename(out),
        actor: upload.actor,
        derivedFrom: stored.map(({ role, name, sha256 }) => ({ role, name, sha256 })),
      });
    } finally {
      await fs.promises.rm(work, { recursive: true, force: true });
    }
  }

  return { importUpload, progressOf };
}

/** The map YAML names its image; the uploaded image is linked under that name. */
async function mapImageName(
  stored: { role: RecordingFileRole; path: string }[],
  fallback: string,
): Promise<string> {
  const yaml = stored.find((file) => file.role === 'map');
  if (!yaml) return fallback;
  const match = /^image:\s*["']?([^"'\n]+)["']?\s*$/m.exec(await fs.promises.readFile(yaml.path, 'utf8'));
  return match ? path.basename(match[1].trim()) : fallback;
}

export type RecordingsService = ReturnType<typeof createRecordingsService>;
