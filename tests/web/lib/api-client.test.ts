import { apiRequest, isApiError, readCookie } from '@web/lib/api-client';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { z } from 'zod';

function jsonResponse(status: number, body: unknown): Response {
  return new Response(JSON.stringify(body), { status, headers: { 'content-type': 'application/json' } });
}

afterEach(() => {
  vi.unstubAllGlobals();
});

describe('readCookie', () => {
  it('reads each pair of the RFC 6265 example Cookie header', () => {
    // RFC 6265 (2011), section 3.1: "Cookie: SID=31d4d96e407aad42; lang=en-US".
    const header = 'SID=31d4d96e407aad42; lang=en-US';
    expect(readCookie(header, 'SID')).toBe('31d4d96e407aad42');
    expect(readCookie(header, 'lang')).toBe('en-US');
    expect(readCookie(header, 'missing')).toBeUndefined();
  });

  it('does not confuse a cookie whose name ends with the wanted name', () => {
    expect(readCookie('old_driftcase_csrf=a; driftcase_csrf=b', 'driftcase_csrf')).toBe('b');
  });
});

describe('apiRequest', () => {
  it('sends the CSRF double-submit header on writes only', async () => {
    const fetchMock = vi.fn(async () => jsonResponse(200, { ok: true }));
    vi.stubGlobal('fetch', fetchMock);
    vi.stubGlobal('document', { cookie: 'driftcase_csrf=token-123; other=x' });

    await apiRequest('/api/cases', { method: 'POST', body: { title: 'x' } });
    await apiRequest('/api/cases');

    const [, writeInit] = fetchMock.mock.calls[0] as unknown as [string, RequestInit];
    const [, readInit] = fetchMock.mock.calls[1] as unknown as [string, RequestInit];
    expect((writeInit.headers as Record<string, string>)['x-csrf-token']).toBe('token-123');
    expect((readInit.headers as Record<string, string>)['x-csrf-token']).toBeUndefined();
  });

  it('turns the error envelope into an ApiError with field issues', async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn(async () =>
        jsonResponse(400, {
          error: {
            code: 'validation_failed',
            message: 'The request body is invalid',
            details: [{ path: 'incidentTime', message: 'Use an RFC 3339 time' }, { nonsense: true }],
          },
        }),
      ),
    );
    const failure = await apiRequest('/api/cases', { method: 'POST', body: {} }).catch(
      (error: unknown) => error,
    );
    expect(isApiError(failure)).toBe(true);
    if (!isApiError(failure)) return;
    expect(failure.status).toBe(400);
    expect(failure.code).toBe('validation_failed');
    expect(failure.fieldIssues).toEqual([{ path: 'incidentTime', message: 'Use an RFC 3339 time' }]);
  });

  it('names the field where a response breaks the expected shape', async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn(async () => jsonResponse(200, { items: [{ id: 7 }] })),
    );
    const schema = z.object({ items: z.array(z.object({ id: z.string() })) });
    const failure = await apiRequest('/api/users', { schema }).catch((error: unknown) => error);
    expect(isApiError(failure) && failure.code).toBe('unexpected_response');
    expect((failure as Error).message).toContain('items.0.id');
  });

  it('reports an unreachable server as a network error, not a crash', async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn(async () => {
        throw new TypeError('fetch failed');
      }),
    );
    const failure = await apiRequest('/api/health').catch((error: unknown) => error);
    expect(isApiError(failure) && failure.code).toBe('network_error');
  });

  it('leaves out empty query values', async () => {
    const fetchMock = vi.fn(async (_url: string) => jsonResponse(200, {}));
    vi.stubGlobal('fetch', fetchMock);
    await apiRequest('/api/cases', { query: { page: 2, q: '', status: undefined, site: 'Dock' } });
    expect(fetchMock.mock.calls[0]?.[0]).toBe('/api/cases?page=2&site=Dock');
  });
});
