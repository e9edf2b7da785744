import type { QueryClient } from '@tanstack/react-query';
import { PageHeader } from '@web/components/page-header';
import { OutboxView } from '@web/features/outbox/components/outbox-view';
import type { LoaderFunctionArgs } from 'react-router-dom';
import { requireRole } from './guards';

export const outboxLoader =
  (queryClient: QueryClient) =>
  ({ request }: LoaderFunctionArgs) =>
    requireRole(queryClient, request, ['admin']);

export function OutboxRoute() {
  return (
    <>
      <PageHeader
        title="Outbox"
        description="Mail captured by the local fake SMTP server; nothing here left the machine."
      />
      <OutboxView />
    </>
  );
}
