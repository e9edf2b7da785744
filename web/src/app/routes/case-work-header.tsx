import { PageHeader } from '@web/components/page-header';
import { CaseStatusBadge } from '@web/components/status-badge';
import { paths } from '@web/config/paths';
import { useCase } from '@web/features/cases/api/get-case';
import { ArrowLeft } from 'lucide-react';
import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';

/** The header of every case-work page: back to the case, its reference and status. */
export function CaseWorkHeader({
  caseId,
  title,
  actions,
}: {
  caseId: string;
  title: string;
  actions?: ReactNode;
}) {
  const item = useCase(caseId).data;
  return (
    <PageHeader
      eyebrow={
        <span className="flex items-center gap-3">
          <Link
            to={paths.caseDetail.href(caseId)}
            className="inline-flex items-center gap-1 text-accent hover:underline"
          >
            <ArrowLeft aria-hidden className="size-4" />
            {item ? `${item.reference} · ${item.title}` : 'Back to the case'}
          </Link>
        </span>
      }
      title={title}
      actions={
        <>
          {actions}
          {item && <CaseStatusBadge status={item.status} />}
        </>
      }
    />
  );
}
