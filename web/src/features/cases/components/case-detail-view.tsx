import type { TCase } from '@shared/contracts/cases';
import { formatUtcInstant } from '@shared/site-time';
import { CasePathTrack } from '@web/components/case-path';
import { LocalTime } from '@web/components/local-time';
import { PageHeader } from '@web/components/page-header';
import { Panel } from '@web/components/panel';
import { SeverityBadge } from '@web/components/severity-badge';
import { EmptyState, ErrorState, SkeletonBar } from '@web/components/states';
import { paths } from '@web/config/paths';
import { isApiError } from '@web/lib/api-client';
import { ArrowLeft, FileQuestion } from 'lucide-react';
import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { useCase } from '../api/get-case';
import { CaseMembersPanel } from './case-members-panel';

function Fact({ label, children }: { label: string; children: ReactNode }) {
  return (
    <div className="py-2">
      <dt className="text-xs font-bold uppercase tracking-wide text-ink-muted">{label}</dt>
      <dd className="mt-0.5 text-sm text-ink">{children}</dd>
    </div>
  );
}

function CaseFacts({ item }: { item: TCase }) {
  return (
    <dl className="grid grid-cols-2 gap-x-6">
      <Fact label="Site">{item.site}</Fact>
      <Fact label="Robot id">
        <span className="tabular-nums">{item.robotId}</span>
      </Fact>
      <Fact label="Incident time">
        <LocalTime iso={item.incidentTime} />
        <span className="block text-xs text-ink-muted tabular-nums">
          {formatUtcInstant(item.incidentTime)}
        </span>
      </Fact>
      <Fact label="Severity">
        <SeverityBadge severity={item.severity} />
      </Fact>
      <Fact label="Opened by">{item.createdBy.name}</Fact>
      <Fact label="Opened">
        <LocalTime iso={item.createdAt} />
      </Fact>
      <Fact label="Last change">
        <LocalTime iso={item.updatedAt} />
      </Fact>
    </dl>
  );
}

export interface CaseDetailSlots {
  /** Shown under the header, e.g. the legal-hold banner. */
  banner?: ReactNode;
  /** Beside the incident facts: the case's bundles and replays. */
  evidence?: ReactNode;
  /** Full-width sections below (case work, evidence archive). */
  sections?: ReactNode;
}

/**
 * The case page frame: header, facts and summary. The app route fills the slots with other
 * features' panels, so this feature does not import them.
 */
export function CaseDetailView({ caseId, banner, evidence, sections }: { caseId: string } & CaseDetailSlots) {
  const caseQuery = useCase(caseId);
  const backLink = (
    <Link to={paths.cases.href()} className="inline-flex items-center gap-1 text-accent hover:underline">
      <ArrowLeft aria-hidden className="size-4" />
      All cases
    </Link>
  );

  if (caseQuery.isError) {
    const isMissing = isApiError(caseQuery.error) && caseQuery.error.status === 404;
    return (
      <>
        {backLink}
        {isMissing ? (
          <EmptyState icon={FileQuestion} title="Case not found">
            No case has this address. It may have been mistyped, or you followed an old link.
          </EmptyState>
        ) : (
          <ErrorState
            error={caseQuery.error}
            title="Could not load this case"
            onRetry={() => caseQuery.refetch()}
          />
        )}
      </>
    );
  }
  const item = caseQuery.data;
  if (!item) {
    return (
      <div aria-busy className="space-y-3">
        <SkeletonBar className="w-32" />
        <SkeletonBar className="h-6 w-96" />
        <div className="h-48 rounded-lg border border-canvas-line bg-canvas-raised" />
      </div>
    );
  }

  return (
    <>
      <PageHeader
        eyebrow={
          <span className="flex items-center gap-3">
            {backLink}
            <span aria-hidden>/</span>
            <span className="font-bold tabular-nums text-ink">{item.reference}</span>
          </span>
        }
        title={item.title}
        actions={<SeverityBadge severity={item.severity} size="lg" />}
      />
      <div className="mb-5">
        <CasePathTrack path={item.path} />
      </div>
      {banner}
      <div className="mb-5 grid grid-cols-[minmax(0,2fr)_minmax(0,3fr)] gap-5">
        <Panel id="case-facts" title="Incident">
          <CaseFacts item={item} />
          <h3 className="mt-3 text-xs font-bold uppercase tracking-wide text-ink-muted">Summary</h3>
          <p className="mt-1 whitespace-pre-line text-sm">
            {item.summary || <span className="text-ink-muted italic">No summary written yet.</span>}
          </p>
        </Panel>
        {evidence}
      </div>
      <CaseMembersPanel caseId={caseId} />
      {sections}
    </>
  );
}
