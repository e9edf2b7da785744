import type { QueryClient } from '@tanstack/react-query';
import { PageHeader } from '@web/components/page-header';
import { EvidenceOrphansPanel } from '@web/features/evidence-orphans/components/evidence-orphans-panel';
import { SigningKeysPanel } from '@web/features/signing-keys/components/signing-keys-panel';
import type { LoaderFunctionArgs } from 'react-router-dom';
import { requireRole } from './guards';

export const evidenceAdminLoader =
  (queryClient: QueryClient) =>
  ({ request }: LoaderFunctionArgs) =>
    requireRole(queryClient, request, ['admin']);

export function EvidenceAdminRoute() {
  return (
    <>
      <PageHeader
        title="Keys and evidence"
        description="The key that signs evidence archives, and files the evidence store keeps without a record."
      />
      <div className="space-y-5">
        <SigningKeysPanel />
        <EvidenceOrphansPanel />
      </div>
    </>
  );
}
