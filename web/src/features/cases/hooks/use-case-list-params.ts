import { useCallback, useMemo } from 'react';
import { useSearchParams } from 'react-router-dom';
import {
  type CaseListParams,
  type CaseSortField,
  parseCaseListParams,
  serializeCaseListParams,
} from './case-list-params';

/** How the list is drawn: rows of a table, or a board of where the cases stand. */
export type CaseListView = 'table' | 'board';
const VIEW_KEY = 'view';

function withView(search: URLSearchParams, view: CaseListView): URLSearchParams {
  if (view === 'board') search.set(VIEW_KEY, 'board');
  return search;
}

/**
 * The case list's sort, filters, page and view live in the URL so reloads and shared links keep
 * them; the view is not an API parameter, so it is carried beside the list parameters.
 */
export function useCaseListParams() {
  const [searchParams, setSearchParams] = useSearchParams();
  const params = useMemo(() => parseCaseListParams(searchParams), [searchParams]);
  const view: CaseListView = searchParams.get(VIEW_KEY) === 'board' ? 'board' : 'table';

  const setView = useCallback(
    (nextView: CaseListView) =>
      setSearchParams(
        (previous) => withView(serializeCaseListParams(parseCaseListParams(previous)), nextView),
        { replace: true },
      ),
    [setSearchParams],
  );

  const update = useCallback(
    (changes: Partial<CaseListParams>, options: { resetPage?: boolean } = { resetPage: true }) => {
      setSearchParams(
        (previous) => {
          const next = { ...parseCaseListParams(previous), ...changes };
          if (options.resetPage) next.page = 1;
          return withView(
            serializeCaseListParams(next),
            previous.get(VIEW_KEY) === 'board' ? 'board' : 'table',
          );
        },
        { replace: true },
      );
    },
    [setSearchParams],
  );

  const toggleSort = useCallback(
    (field: CaseSortField) => {
      // Times and severity read best newest/worst first; names read best A to Z.
      const firstOrder = field === 'title' || field === 'site' ? 'asc' : 'desc';
      const order = params.sort === field ? (params.order === 'asc' ? 'desc' : 'asc') : firstOrder;
      update({ sort: field, order });
    },
    [params.sort, params.order, update],
  );

  return { params, update, toggleSort, view, setView };
}
