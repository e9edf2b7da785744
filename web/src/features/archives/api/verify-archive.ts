import { type TArchiveVerification, ZArchiveVerification } from '@shared/contracts/archives';
import { CSRF_COOKIE, CSRF_HEADER } from '@shared/contracts/auth';
import { isErrorBody } from '@shared/errors';
import { useMutation } from '@tanstack/react-query';
import { apiPaths } from '@web/config/paths';
import { ApiError, readCookie } from '@web/lib/api-client';

/** Uploads an archive (multipart field `archive`) and returns the server's checks. */
export async function verifyArchiveUpload(file: File): Promise<TArchiveVerification> {
  const form = new FormData();
  form.append('archive', file);
  const token = readCookie(document.cookie, CSRF_COOKIE);
  let response: Response;
  try {
    response = await fetch(apiPaths.verifyArchive, {
      method: 'POST',
      body: form,
      credentials: 'same-origin',
      headers: { accept: 'application/json', ...(token ? { [CSRF_HEADER]: token } : {}) },
    });
  } catch {
    throw new ApiError(0, 'network_error', 'Cannot reach the Driftcase server. Check your connection.');
  }
  const payload: unknown = await response.json().catch(() => undefined);
  if (!response.ok) {
    if (isErrorBody(payload)) throw new ApiError(response.status, payload.error.code, payload.error.message);
    throw new ApiError(response.status, 'unexpected_response', `The server answered ${response.status}.`);
  }
  const parsed = ZArchiveVerification.safeParse(payload);
  if (!parsed.success)
    throw new ApiError(
      response.status,
      'unexpected_response',
      'The verification answer has an unexpected shape.',
    );
  return parsed.data;
}

export function useVerifyArchive() {
  return useMutation({ mutationFn: verifyArchiveUpload });
}
