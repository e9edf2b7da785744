import { type TBundleRecord, ZUploadResponse } from '@shared/contracts/bundles';
import { isErrorBody } from '@shared/errors';
import { apiPaths } from '@web/config/paths';
import { sendFormWithProgress, uploadAnswerError } from '@web/lib/send-form-with-progress';
import { useCaseUpload } from './use-case-upload';

/** The multipart fields of `POST /api/cases/:id/recordings`, one file each. */
export const RECORDING_FILE_ROLES = ['recording', 'map', 'map_image', 'params', 'robot'] as const;
export type RecordingFileRole = (typeof RECORDING_FILE_ROLES)[number];
export type RecordingFiles = Partial<Record<RecordingFileRole, File>>;

export interface RecordingUpload {
  files: RecordingFiles;
  /** Seconds from the recording's start or an RFC 3339 time; empty means not given. */
  incident?: string;
  /** The page's id for polling how far the server got once the bytes are sent. */
  progressId?: string;
}

/**
 * What became of a recording: read into a bundle (valid, or stored but invalid with its issues),
 * or not readable at all, with the server's message naming file, topic and message time. In
 * every case the originals were kept as evidence first.
 */
export type RecordingOutcome =
  | { kind: 'bundle'; bundle: TBundleRecord; duplicate: boolean }
  | { kind: 'unreadable'; message: string };

export async function uploadRecording(
  caseId: string,
  upload: RecordingUpload,
  onProgress: (fraction: number) => void,
): Promise<RecordingOutcome> {
  const form = new FormData();
  if (upload.incident?.trim()) form.append('incident', upload.incident.trim());
  if (upload.progressId) form.append('progress_id', upload.progressId);
  for (const role of RECORDING_FILE_ROLES) {
    const file = upload.files[role];
    if (file) form.append(role, file, file.name);
  }
  const { status, payload } = await sendFormWithProgress(apiPaths.caseRecordings(caseId), form, onProgress);
  // 201 new, 200 already on the case, 422 read into a bundle that is not valid: all carry the bundle.
  const answered = ZUploadResponse.safeParse(payload);
  if ((status === 200 || status === 201 || status === 422) && answered.success) {
    return { kind: 'bundle', ...answered.data };
  }
  if (isErrorBody(payload) && payload.error.code === 'invalid_recording') {
    return { kind: 'unreadable', message: payload.error.message };
  }
  throw uploadAnswerError(status, payload);
}

/** Recording upload with its progress (0..1); refreshes the case's bundle list either way. */
export function useUploadRecording(caseId: string) {
  return useCaseUpload(caseId, uploadRecording);
}
