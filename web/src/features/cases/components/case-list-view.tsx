import { PageHeader } from '@web/components/page-header';
import { Pagination } from '@web/components/pagination';
import { EmptyState, ErrorState } from '@web/components/states';
import { paths } from '@web/config/paths';
import { classNames } from '@web/lib/class-names';
import { Columns3, FolderOpen, Plus, Rows3 } from 'lucide-react';
import { Link } from 'react-router-dom';
import { useCases } from '../api/get-cases';
import { useCaseListParams, type CaseListView as ViewName } from '../hooks/use-case-list-params';
import { CaseBoard } from './case-board';
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

function ViewSwitch({ view, onChange }: { view: ViewName; onChange: (view: ViewName) => void }) {
  const options = [
    { value: 'table' as const, label: 'Table', icon: Rows3 },
    { value: 'board' as const, label: 'Board', icon: Columns3 },
  ];
  return (
    <fieldset className="inline-flex rounded-md border border-canvas-line bg-canvas-raised p-0.5">
      <legend className="sr-only">Show the cases as</legend>
      {options.map(({ value, label, icon: Icon }) => (
        <label
          key={value}
          className={classNames(
            'inline-flex cursor-pointer items-center gap-1.5 rounded px-3 py-1.5 text-sm has-[:focus-visible]:outline-2 has-[:focus-visible]:outline-accent',
            view === value ? 'bg-chrome-800 font-bold text-white' : 'text-ink-muted hover:text-ink',
          )}
        >
          <input
            type="radio"
            name="case-view"
            value={value}
            checked={view === value}
            onChange={() => onChange(value)}
            className="sr-only"
          />
          <Icon aria-hidden className="size-4" />
          {label}
        </label>
      ))}
    </fieldset>
  );
}

export function CaseListView({ canCreateCase }: { canCreateCase: boolean }) {
  const { params, update, toggleSort, view, setView } = useCaseListParams();
  const casesQuery = useCases(params);
  const hasFilters = Boolean(params.q || params.status || params.severity || params.site);
  const list = casesQuery.data;

  return (
    <>
      <PageHeader
        title="Cases"
        description="Incidents under investigation: where each stands on its path and who holds it."
        actions={
          <>
            <ViewSwitch view={view} onChange={setView} />
            {canCreateCase && <NewCaseLink />}
          </>
        }
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
        ) : view === 'board' ? (
          <CaseBoard cases={list?.items} isRefreshing={casesQuery.isPlaceholderData} />
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
