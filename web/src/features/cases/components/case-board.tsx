import { CASE_STAGE_LABELS } from '@shared/case-path';
import { CASE_STAGES, type TCase, type TCaseStage } from '@shared/contracts/cases';
import { countOf } from '@shared/human-labels';
import { describeHolders } from '@web/components/case-path';
import { LocalTime } from '@web/components/local-time';
import { SeverityBadge } from '@web/components/severity-badge';
import { SkeletonBar } from '@web/components/states';
import { paths } from '@web/config/paths';
import { Link } from 'react-router-dom';

type Column = TCaseStage | 'none';

const COLUMNS: readonly Column[] = ['none', ...CASE_STAGES];
const COLUMN_TITLES: Record<Column, string> = { none: 'No evidence yet', ...CASE_STAGE_LABELS };

function CaseCard({ item }: { item: TCase }) {
  return (
    <li className="rounded-md border border-canvas-line bg-canvas-raised p-2.5 shadow-sm">
      <Link
        to={paths.caseDetail.href(item.id)}
        className="text-xs font-bold text-accent tabular-nums hover:underline"
      >
        {item.reference}
      </Link>
      <p className="mt-0.5 line-clamp-2 text-sm font-bold text-ink" title={item.title}>
        {item.title}
      </p>
      <div className="mt-1.5">
        <SeverityBadge severity={item.severity} />
      </div>
      <p className="mt-1.5 text-xs text-ink-muted">{item.path.summary}</p>
      <p className="text-xs text-ink-muted">
        <span className="font-bold text-ink">{describeHolders(item.path.holders)}</span> since{' '}
        <LocalTime iso={item.path.since} />
      </p>
    </li>
  );
}

/**
 * The case list as a board of where cases stand: one column per stage, each case under the
 * furthest stage it has reached. It shows the page of cases the filters and paging select.
 */
export function CaseBoard({ cases, isRefreshing }: { cases: TCase[] | undefined; isRefreshing: boolean }) {
  return (
    <div
      aria-busy={!cases || isRefreshing}
      // Seven stages never fit a narrow window: columns keep a readable width and the board scrolls.
      className={`grid grid-cols-[repeat(7,minmax(8.25rem,1fr))] gap-2 overflow-x-auto p-2 ${isRefreshing ? 'opacity-60 transition-opacity' : ''}`}
    >
      {COLUMNS.map((column) => {
        const inColumn = cases?.filter((item) => (item.path.standing ?? 'none') === column);
        return (
          <section
            key={column}
            aria-label={COLUMN_TITLES[column]}
            className="min-w-0 rounded-md bg-canvas-sunk/70 p-1.5"
          >
            <h2 className="flex items-start justify-between gap-1 px-1 pb-1.5 text-xs leading-tight font-bold tracking-wide text-ink-muted uppercase">
              {/* Titles wrap rather than cut off: "Findings drafted" must read whole. */}
              <span className="min-w-0 break-words">{COLUMN_TITLES[column]}</span>
              <span className="tabular-nums">{inColumn ? inColumn.length : ''}</span>
            </h2>
            {!inColumn ? (
              <SkeletonBar className="h-20 w-full" />
            ) : inColumn.length === 0 ? (
              <p className="px-1 py-3 text-xs text-ink-faint italic">{countOf(0, 'case')}</p>
            ) : (
              <ul className="space-y-1.5">
                {inColumn.map((item) => (
                  <CaseCard key={item.id} item={item} />
                ))}
              </ul>
            )}
          </section>
        );
      })}
    </div>
  );
}
