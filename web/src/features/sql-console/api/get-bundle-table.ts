import { apiPaths } from '@web/config/paths';
import { ApiError, apiRequest } from '@web/lib/api-client';

/** Downloads one of the bundle's tables as Arrow IPC stream bytes, ready for DuckDB. */
export async function getBundleTable(
  bundleId: string,
  table: string,
  signal?: AbortSignal,
): Promise<Uint8Array> {
  const path = apiPaths.bundleTable(bundleId, table);
  const response = await fetch(path, { credentials: 'same-origin', signal });
  if (!response.ok) {
    // Error answers are JSON; let the one API wrapper turn them into a typed error.
    await apiRequest(path, { signal });
    throw new ApiError(response.status, 'unexpected_response', `Table ${table} answered ${response.status}.`);
  }
  return new Uint8Array(await response.arrayBuffer());
}
