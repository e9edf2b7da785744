import {
  type TBundleIssue,
  type TBundleRecord,
  ZBundleIssue,
  ZBundleRecord,
  ZUploadResponse,
} from '@shared/contracts/bundles';
import { isErrorBody } from '@shared/errors';
import { apiPaths } from '@web/config/paths';
import { ApiError } from '@web/lib/api-client';
import { sendFormWithProgress, uploadAnswerError } from '@web/lib/send-form-with-progress';
import { z } from 'zod';
import { useCaseUpload } from './use-case-upload';

/** What the server decided about an upload: stored and valid, or stored but invalid with its issues. */
export type UploadOutcome =
  | { kind: 'valid'; bundle: TBundleRecord; duplicate: boolean }
  | { kind: 'invalid'; bundle: TBundleRecord; issues: TBundleIssue[]; message: string };

const ZRejectionDetails = z.object({ bundle: ZBundleRecord, issues: z.array(ZBundleIssue) });

/** Sends a bundle zip as multipart field `bundle`. */
export async function uploadBundle(
  caseId: string,
  file: File,
  onProgress: (fraction: number) => void,
): Promise<UploadOutcome> {
  const form = new FormData();
  form.append('bundle', file, file.name);
  const { status, payload } = await sendFormWithProgress(apiPaths.caseBundles(caseId), form, onProgress);
  if (status === 200 || status === 201) {
    const parsed = ZUploadResponse.safeParse(payload);
    if (parsed.success) return { kind: 'valid', ...parsed.data };
    throw new ApiError(status, 'unexpected_response', 'The upload answer has an unexpected shape.');
  }
  if (isErrorBody(payload) && payload.error.code === 'invalid_bundle') {
    const rejection = ZRejectionDetails.safeParse(payload.error.details);
    if (rejection.success) return { kind: 'invalid', ...rejection.data, message: payload.error.message };
  }
  throw uploadAnswerError(status, payload);
}

/** Upload with its progress (0..1); refreshes the case's bundle list either way. */
export function useUploadBundle(caseId: string) {
  return useCaseUpload(caseId, uploadBundle);
}
