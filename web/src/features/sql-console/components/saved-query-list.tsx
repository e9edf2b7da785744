import type { TSavedQuery } from '@shared/contracts/saved-queries';
import { Button } from '@web/components/button';
import { LocalTime } from '@web/components/local-time';
import { EmptyState, ErrorState, SkeletonBar } from '@web/components/states';
import { FileSearch } from 'lucide-react';
import { useSavedQueries } from '../api/get-saved-queries';

interface SavedQueryListProps {
  caseId: string;
  /** Only this bundle's queries can be re-run here; others are listed for reference. */
  bundleId: string;
  onLoad: (query: TSavedQuery) => void;
}

/** The case's saved queries with their result hashes; one click puts a query back in the editor. */
export function SavedQueryList({ caseId, bundleId, onLoad }: SavedQueryListProps) {
  const queries = useSavedQueries(caseId);
  if (queries.isPending) return <SkeletonBar className="w-48" />;
  if (queries.isError)
    return (
      <ErrorState error={queries.error} title="Could not load saved queries" onRetry={queries.refetch} />
    );
  if (!queries.data.length)
    return (
      <EmptyState icon={FileSearch} title="No saved queries yet">
        Run a query and save it to the case as evidence.
      </EmptyState>
    );
  return (
    <ul aria-label="Saved queries" className="divide-y divide-canvas-line">
      {queries.data.map((query) => (
        <li key={query.id} className="flex items-start justify-between gap-3 py-2">
          <div className="min-w-0 text-sm">
            <p className="font-bold text-ink">{query.title}</p>
            <p className="text-xs text-ink-muted">
              {query.rowCount} rows · {query.author.name} · <LocalTime iso={query.createdAt} />
            </p>
            <p className="truncate font-mono text-xs text-ink-muted" title={query.resultSha256}>
              SHA-256 {query.resultSha256.slice(0, 16)}…
              {query.isHashCheckedByServer ? ' (checked by server)' : ''}
            </p>
          </div>
          <Button
            size="sm"
            disabled={query.bundleId !== bundleId}
            title={query.bundleId === bundleId ? 'Put this query in the editor' : 'Saved for another bundle'}
            aria-label={`Open ${query.title}`}
            onClick={() => onLoad(query)}
          >
            Open
          </Button>
        </li>
      ))}
    </ul>
  );
}
