import { describeHolders } from '@web/components/case-path';
import { PageHeader } from '@web/components/page-header';
import { SeverityBadge } from '@web/components/severity-badge';
import { paths } from '@web/config/paths';
import { useCase } from '@web/features/cases/api/get-case';
import { ArrowLeft } from 'lucide-react';
import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';

/** The header of every case-work page: back to the case, its reference, severity and where it stands. */
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
          {item && (
            <span className="flex items-center gap-3 text-sm">
              <SeverityBadge severity={item.severity} />
              <span className="text-right">
                <span className="block font-bold">{item.path.summary}</span>
                <span className="block text-xs text-ink-muted">
                  held by {describeHolders(item.path.holders)}
                </span>
              </span>
            </span>
          )}
        </>
      }
    />
  );
}
