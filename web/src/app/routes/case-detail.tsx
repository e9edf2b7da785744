import type { QueryClient } from '@tanstack/react-query';
import { caseQueryOptions } from '@web/features/cases/api/get-case';
import { CaseDetailView } from '@web/features/cases/components/case-detail-view';
import { type LoaderFunctionArgs, useParams } from 'react-router-dom';

/** Starts the request during navigation; the page shows its own loading and error states. */
export const caseDetailLoader =
  (queryClient: QueryClient) =>
  ({ params }: LoaderFunctionArgs) => {
    if (params.caseId) void queryClient.prefetchQuery(caseQueryOptions(params.caseId));
    return null;
  };

export function CaseDetailRoute() {
  const { caseId = '' } = useParams();
  return <CaseDetailView caseId={caseId} />;
}
