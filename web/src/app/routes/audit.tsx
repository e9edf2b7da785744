import type { QueryClient } from '@tanstack/react-query';
import { AuditTrailView } from '@web/features/audit/components/audit-trail-view';
import { type LoaderFunctionArgs, useParams } from 'react-router-dom';
import { CaseWorkHeader } from './case-work-header';
import { requireRole } from './guards';

export const auditLoader =
  (queryClient: QueryClient) =>
  ({ request }: LoaderFunctionArgs) =>
    requireRole(queryClient, request, ['reviewer', 'legal', 'admin']);

export function AuditRoute() {
  const { caseId = '' } = useParams();
  return (
    <>
      <CaseWorkHeader caseId={caseId} title="Audit trail" />
      <AuditTrailView caseId={caseId} />
    </>
  );
}
