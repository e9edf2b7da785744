import type { TCase } from '@shared/contracts/cases';
import { CasePathCompact } from '@web/components/case-path';
import { LocalTime } from '@web/components/local-time';
import { SeverityBadge } from '@web/components/severity-badge';
import { SortableHeader } from '@web/components/sortable-header';
import { SkeletonBar } from '@web/components/states';
import { paths } from '@web/config/paths';
import { Link } from 'react-router-dom';
import type { CaseListParams, CaseSortField } from '../hooks/case-list-params';

interface CasesTableProps {
  cases: TCase[] | undefined;
  params: CaseListParams;
  onSort: (field: CaseSortField) => void;
  /** True while a new page replaces the one on screen: the rows dim instead of vanishing. */
  isRefreshing: boolean;
}

const SORT_WORDS: Record<CaseSortField, string> = {
  incidentTime: 'incident time',
  createdAt: 'opening time',
  title: 'title',
  severity: 'severity',
  status: 'path',
  site: 'site',
};

const HEAD = 'px-3 py-2 text-left text-xs font-bold text-ink-muted';
const CELL = 'px-3 py-2.5 align-middle';
// Below 1280 px the robot id moves under the title, so the title keeps room to be read.
const WIDE_ONLY = 'hidden xl:table-cell';

function SkeletonRows({ count }: { count: number }) {
  return Array.from({ length: count }, (_, row) => (
    // biome-ignore lint/suspicious/noArrayIndexKey: placeholder rows have no identity
    <tr key={row} className="border-t border-canvas-line">
      {['w-16', 'w-48', 'w-24', 'w-14', 'w-28', 'w-16', 'w-40'].map((width) => (
        <td key={width} className={width === 'w-14' ? `${CELL} ${WIDE_ONLY}` : CELL}>
          <SkeletonBar className={width} />
        </td>
      ))}
    </tr>
  ));
}

export function CasesTable({ cases, params, onSort, isRefreshing }: CasesTableProps) {
  const sortProps = (field: CaseSortField) => ({
    isActive: params.sort === field,
    order: params.order,
    onSort: () => onSort(field),
    className: HEAD,
  });
  return (
    <table className="w-full table-fixed border-collapse text-sm" aria-busy={!cases || isRefreshing}>
      <caption className="sr-only">
        Cases, sorted by {SORT_WORDS[params.sort]} ({params.order === 'asc' ? 'ascending' : 'descending'})
      </caption>
      <colgroup>
        <col className="w-[6.5rem]" />
        <col />
        <col className="w-[8.5rem] xl:w-[10rem]" />
        <col className="hidden w-[6.5rem] xl:table-column" />
        <col className="w-[10.5rem]" />
        <col className="w-[6.5rem]" />
        <col className="w-[15rem] xl:w-[17rem]" />
      </colgroup>
      <thead className="bg-canvas-sunk/60">
        <tr>
          <th scope="col" className={HEAD}>
            Reference
          </th>
          <SortableHeader label="Title" {...sortProps('title')} />
          <SortableHeader label="Site" {...sortProps('site')} />
          <th scope="col" className={`${HEAD} ${WIDE_ONLY}`}>
            Robot
          </th>
          <SortableHeader label="Incident time" {...sortProps('incidentTime')} />
          <SortableHeader label="Severity" {...sortProps('severity')} />
          <SortableHeader label="Path" {...sortProps('status')} />
        </tr>
      </thead>
      <tbody className={isRefreshing ? 'opacity-60 transition-opacity' : undefined}>
        {!cases ? (
          <SkeletonRows count={Math.min(params.pageSize, 8)} />
        ) : (
          cases.map((item) => (
            <tr key={item.id} className="border-t border-canvas-line hover:bg-accent-soft/40">
              <td className={`${CELL} font-bold tabular-nums`}>
                <Link to={paths.caseDetail.href(item.id)} className="text-accent hover:underline">
                  {item.reference}
                </Link>
              </td>
              <td className={`${CELL} truncate`} title={item.title}>
                {item.title}
                <span className="block truncate text-xs text-ink-muted tabular-nums xl:hidden">
                  Robot {item.robotId}
                </span>
              </td>
              <td className={`${CELL} truncate`} title={item.site}>
                {item.site}
              </td>
              <td className={`${CELL} ${WIDE_ONLY} truncate tabular-nums`} title={item.robotId}>
                {item.robotId}
              </td>
              <td className={CELL}>
                <LocalTime iso={item.incidentTime} />
              </td>
              <td className={CELL}>
                <SeverityBadge severity={item.severity} />
              </td>
              <td className={CELL}>
                <CasePathCompact path={item.path} />
              </td>
            </tr>
          ))
        )}
      </tbody>
    </table>
  );
}
