import { useCallback, useMemo } from 'react';
import { useSearchParams } from 'react-router-dom';
import {
  type CaseListParams,
  type CaseSortField,
  parseCaseListParams,
  serializeCaseListParams,
} from './case-list-params';

/** The case list's sort, filters and page live in the URL so reloads and shared links keep them. */
export function useCaseListParams() {
  const [searchParams, setSearchParams] = useSearchParams();
  const params = useMemo(() => parseCaseListParams(searchParams), [searchParams]);

  const update = useCallback(
    (changes: Partial<CaseListParams>, options: { resetPage?: boolean } = { resetPage: true }) => {
      setSearchParams(
        (previous) => {
          const next = { ...parseCaseListParams(previous), ...changes };
          if (options.resetPage) next.page = 1;
          return serializeCaseListParams(next);
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

  return { params, update, toggleSort };
}
