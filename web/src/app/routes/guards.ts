import type { TMeResponse } from '@shared/contracts/auth';
import type { Role } from '@shared/roles';
import type { QueryClient } from '@tanstack/react-query';
import { paths } from '@web/config/paths';
import { meQueryOptions } from '@web/features/auth/api/get-me';
import { isApiError } from '@web/lib/api-client';
import { data, redirect } from 'react-router-dom';

/** Loads the session for a route; without one, sends the person to sign in and back here afterwards. */
export async function requireSession(queryClient: QueryClient, request: Request): Promise<TMeResponse> {
  try {
    return await queryClient.ensureQueryData(meQueryOptions());
  } catch (error) {
    if (isApiError(error) && error.status === 401) {
      const url = new URL(request.url);
      throw redirect(paths.signIn.href(url.pathname + url.search));
    }
    throw error;
  }
}

/** Also checks the role; the server checks again, this only spares the person a page of errors. */
export async function requireRole(
  queryClient: QueryClient,
  request: Request,
  roles: readonly Role[],
): Promise<TMeResponse> {
  const me = await requireSession(queryClient, request);
  if (!roles.includes(me.user.role)) {
    throw data({ message: 'Your role does not give access to this page.' }, { status: 403 });
  }
  return me;
}
