import { PageHeader } from '@web/components/page-header';
import { Pagination } from '@web/components/pagination';
import { EmptyState, ErrorState } from '@web/components/states';
import { paths } from '@web/config/paths';
import { FolderOpen, Plus } from 'lucide-react';
import { Link } from 'react-router-dom';
import { useCases } from '../api/get-cases';
import { useCaseListParams } from '../hooks/use-case-list-params';
import { CaseFilters } from './case-filters';
import { CasesTable } from './cases-table';

function NewCaseLink() {
  return (
    <Link
      to={paths.newCase.href()}
      className="inline-flex h-10 items-center gap-2 rounded-md bg-accent px-4 text-sm font-bold text-white hover:bg-accent-strong"
    >
      <Plus aria-hidden className="size-4" />
      New case
    </Link>
  );
}

export function CaseListView({ canCreateCase }: { canCreateCase: boolean }) {
  const { params, update, toggleSort } = useCaseListParams();
  const casesQuery = useCases(params);
  const hasFilters = Boolean(params.q || params.status || params.severity || params.site);
  const list = casesQuery.data;

  return (
    <>
      <PageHeader
        title="Cases"
        description="Incidents under investigation and their records."
        actions={canCreateCase && <NewCaseLink />}
      />
      <CaseFilters params={params} onChange={update} />
      <section
        aria-label="Case list"
        className="mt-4 overflow-hidden rounded-lg border border-canvas-line bg-canvas-raised shadow-sm"
      >
        {casesQuery.isError && !list ? (
          <ErrorState
            error={casesQuery.error}
            title="Could not load cases"
            onRetry={() => casesQuery.refetch()}
          />
        ) : list && list.total === 0 ? (
          <EmptyState
            icon={FolderOpen}
            title={hasFilters ? 'No cases match these filters' : 'No cases yet'}
            action={!hasFilters && canCreateCase && <NewCaseLink />}
          >
            {hasFilters
              ? 'Change or clear the filters to see more cases.'
              : 'Cases appear here once an investigator opens one.'}
          </EmptyState>
        ) : (
          <CasesTable
            cases={list?.items}
            params={params}
            onSort={toggleSort}
            isRefreshing={casesQuery.isPlaceholderData}
          />
        )}
      </section>
      {list && list.total > 0 && (
        <div className="mt-3">
          <Pagination
            page={params.page}
            pageSize={params.pageSize}
            total={list.total}
            itemLabel="cases"
            onPageChange={(page) => update({ page }, { resetPage: false })}
            onPageSizeChange={(pageSize) => update({ pageSize })}
          />
        </div>
      )}
    </>
  );
}
