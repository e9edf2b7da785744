import { SelectInput } from '@web/components/inputs';
import { PageHeader } from '@web/components/page-header';
import { EmptyState, ErrorState, SkeletonBar } from '@web/components/states';
import { paths } from '@web/config/paths';
import { useBundleReplays } from '@web/features/replays/api/get-bundle-replays';
import { CompareWorkspace } from '@web/features/workspace/components/compare-workspace';
import { ArrowLeft, Columns2 } from 'lucide-react';
import { Link, useParams, useSearchParams } from 'react-router-dom';

/** What-if comparison: two replays of one bundle, side by side on one time cursor. */
export function CompareRoute() {
  const { bundleId = '' } = useParams();
  const [search, setSearch] = useSearchParams();
  const replays = useBundleReplays(bundleId);
  const finished = (replays.data?.items ?? []).filter((r) => r.status === 'done');
  const leftId = search.get('left') ?? finished[1]?.id;
  const rightId = search.get('right') ?? finished[0]?.id;
  const left = finished.find((r) => r.id === leftId);
  const right = finished.find((r) => r.id === rightId);
  const pick = (side: 'left' | 'right', id: string) => {
    const next = new URLSearchParams(search);
    next.set(side, id);
    setSearch(next);
  };
  const picker = (side: 'left' | 'right', value: string | undefined) => (
    <label htmlFor={`compare-${side}`} className="flex items-center gap-2 text-sm font-bold">
      {side === 'left' ? 'Left replay' : 'Right replay'}
      <SelectInput
        id={`compare-${side}`}
        value={value ?? ''}
        onChange={(e) => pick(side, e.target.value)}
        className="w-72"
      >
        {finished.map((r) => (
          <option key={r.id} value={r.id}>
            {`${r.label || 'Untitled replay'} · ${r.digest?.slice(0, 8) ?? ''}`}
          </option>
        ))}
      </SelectInput>
    </label>
  );

  return (
    <>
      <PageHeader
        eyebrow={
          <Link
            to={paths.workspace.href(bundleId)}
            className="inline-flex items-center gap-1 text-accent hover:underline"
          >
            <ArrowLeft aria-hidden className="size-4" /> Back to the workspace
          </Link>
        }
        title="Compare replays"
        description="Scrub two replays of the same bundle with one time cursor to see whether other settings would have kept the robot localized."
      />
      {replays.isError ? (
        <ErrorState
          error={replays.error}
          title="Could not load the replays"
          onRetry={() => replays.refetch()}
        />
      ) : !replays.data ? (
        <SkeletonBar className="h-80 w-full" />
      ) : finished.length < 2 ? (
        <EmptyState icon={Columns2} title="Two finished replays are needed">
          Start a second replay with other settings in the workspace, then compare them here.
        </EmptyState>
      ) : (
        <>
          <div className="mb-4 flex flex-wrap gap-6">
            {picker('left', left?.id)}
            {picker('right', right?.id)}
          </div>
          {left && right && (
            <CompareWorkspace key={`${left.id}-${right.id}`} bundleId={bundleId} left={left} right={right} />
          )}
        </>
      )}
    </>
  );
}
