import type { QueryClient } from '@tanstack/react-query';
import { PageHeader } from '@web/components/page-header';
import { paths } from '@web/config/paths';
import { CreateCaseForm } from '@web/features/cases/components/create-case-form';
import { type LoaderFunctionArgs, useNavigate } from 'react-router-dom';
import { CASE_CREATOR_ROLES } from '../shell/navigation';
import { requireRole } from './guards';

export const newCaseLoader =
  (queryClient: QueryClient) =>
  ({ request }: LoaderFunctionArgs) =>
    requireRole(queryClient, request, CASE_CREATOR_ROLES);

export function NewCaseRoute() {
  const navigate = useNavigate();
  return (
    <div className="max-w-3xl">
      <PageHeader
        title="New case"
        description="Open a case as soon as an incident is reported; bundles, replays and findings are added to it later."
      />
      <div className="rounded-lg border border-canvas-line bg-canvas-raised p-6 shadow-sm">
        <CreateCaseForm
          onCreated={(created) => navigate(paths.caseDetail.href(created.id))}
          onCancel={() => navigate(paths.cases.href())}
        />
      </div>
    </div>
  );
}
