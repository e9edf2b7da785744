import { CSRF_COOKIE, CSRF_HEADER } from '@shared/contracts/auth';
import {
  type TBundleIssue,
  type TBundleRecord,
  ZBundleIssue,
  ZBundleRecord,
  ZUploadResponse,
} from '@shared/contracts/bundles';
import { isErrorBody } from '@shared/errors';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiPaths } from '@web/config/paths';
import { ApiError, readCookie } from '@web/lib/api-client';
import { useState } from 'react';
import { z } from 'zod';
import { caseBundlesQueryOptions } from './get-case-bundles';

/** What the server decided about an upload: stored and valid, or stored but invalid with its issues. */
export type UploadOutcome =
  | { kind: 'valid'; bundle: TBundleRecord; duplicate: boolean }
  | { kind: 'invalid'; bundle: TBundleRecord; issues: TBundleIssue[]; message: string };

const ZRejectionDetails = z.object({ bundle: ZBundleRecord, issues: z.array(ZBundleIssue) });

function parseJson(text: string): unknown {
  try {
    return text ? JSON.parse(text) : undefined;
  } catch {
    return undefined;
  }
}

/**
 * Sends a bundle zip as multipart field `bundle`. XMLHttpRequest rather than fetch, because only it
 * reports upload progress; the CSRF double-submit header is added as `apiRequest` does.
 */
export function uploadBundle(
  caseId: string,
  file: File,
  onProgress: (fraction: number) => void,
): Promise<UploadOutcome> {
  return new Promise((resolve, reject) => {
    const request = new XMLHttpRequest();
    request.open('POST', apiPaths.caseBundles(caseId));
    request.withCredentials = true;
    request.setRequestHeader('accept', 'application/json');
    const token = readCookie(document.cookie, CSRF_COOKIE);
    if (token) request.setRequestHeader(CSRF_HEADER, token);
    request.upload.onprogress = (event) => {
      if (event.lengthComputable) onProgress(event.loaded / event.total);
    };
    request.onerror = () =>
      reject(new ApiError(0, 'network_error', 'Cannot reach the Driftcase server. Check your connection.'));
    request.onload = () => {
      const payload = parseJson(request.responseText);
      if (request.status === 200 || request.status === 201) {
        const parsed = ZUploadResponse.safeParse(payload);
        if (parsed.success) resolve({ kind: 'valid', ...parsed.data });
        else
          reject(
            new ApiError(request.status, 'unexpected_response', 'The upload answer has an unexpected shape.'),
          );
        return;
      }
      if (isErrorBody(payload)) {
        const rejection = ZRejectionDetails.safeParse(payload.error.details);
        if (payload.error.code === 'invalid_bundle' && rejection.success) {
          resolve({ kind: 'invalid', ...rejection.data, message: payload.error.message });
          return;
        }
        reject(
          new ApiError(request.status, payload.error.code, payload.error.message, payload.error.details),
        );
        return;
      }
      reject(new ApiError(request.status, 'unexpected_response', `The server answered ${request.status}.`));
    };
    const form = new FormData();
    form.append('bundle', file, file.name);
    request.send(form);
  });
}

/** Upload with its progress (0..1); refreshes the case's bundle list either way. */
export function useUploadBundle(caseId: string) {
  const queryClient = useQueryClient();
  const [progress, setProgress] = useState(0);
  const mutation = useMutation({
    mutationFn: (file: File) => {
      setProgress(0);
      return uploadBundle(caseId, file, setProgress);
    },
    onSettled: () => queryClient.invalidateQueries({ queryKey: caseBundlesQueryOptions(caseId).queryKey }),
  });
  return { ...mutation, progress };
}
