import type { QueryClient } from '@tanstack/react-query';
import { useMe } from '@web/features/auth/api/get-me';
import { UsersView } from '@web/features/users/components/users-view';
import type { LoaderFunctionArgs } from 'react-router-dom';
import { requireRole } from './guards';

export const usersLoader =
  (queryClient: QueryClient) =>
  ({ request }: LoaderFunctionArgs) =>
    requireRole(queryClient, request, ['admin']);

export function UsersRoute() {
  const { data } = useMe();
  return <UsersView currentUserId={data?.user.id ?? ''} />;
}
