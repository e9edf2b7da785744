import { CSRF_COOKIE, CSRF_HEADER } from '@shared/contracts/auth';
import { isErrorBody } from '@shared/errors';
import { ApiError, readCookie } from './api-client';

function parseJson(text: string): unknown {
  try {
    return text ? JSON.parse(text) : undefined;
  } catch {
    return undefined;
  }
}

/**
 * POSTs a multipart form and reports upload progress (0..1). XMLHttpRequest rather than fetch,
 * because only it reports upload progress; the CSRF double-submit header is added as
 * `apiRequest` does. Resolves with any HTTP answer (the caller reads its status); rejects only
 * when the server cannot be reached.
 */
export function sendFormWithProgress(
  url: string,
  form: FormData,
  onProgress: (fraction: number) => void,
): Promise<{ status: number; payload: unknown }> {
  return new Promise((resolve, reject) => {
    const request = new XMLHttpRequest();
    request.open('POST', url);
    request.withCredentials = true;
    request.setRequestHeader('accept', 'application/json');
    const token = readCookie(document.cookie, CSRF_COOKIE);
    if (token) request.setRequestHeader(CSRF_HEADER, token);
    request.upload.onprogress = (event) => {
      if (event.lengthComputable) onProgress(event.loaded / event.total);
    };
    request.onerror = () =>
      reject(new ApiError(0, 'network_error', 'Cannot reach the Driftcase server. Check your connection.'));
    request.onload = () => resolve({ status: request.status, payload: parseJson(request.responseText) });
    request.send(form);
  });
}

/** The typed error for an upload answer the caller did not accept, as `apiRequest` would throw it. */
export function uploadAnswerError(status: number, payload: unknown): ApiError {
  if (isErrorBody(payload)) {
    return new ApiError(status, payload.error.code, payload.error.message, payload.error.details);
  }
  return new ApiError(status, 'unexpected_response', `The server answered ${status}.`);
}
