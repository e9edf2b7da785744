import type { TBookmark } from '@shared/contracts/bookmarks';
import { MAX_PARTICLES } from '@shared/engine/settings';
import type { QueryClient } from '@tanstack/react-query';
import { PageHeader } from '@web/components/page-header';
import { EmptyState, ErrorState, SkeletonBar } from '@web/components/states';
import { paths } from '@web/config/paths';
import { useMe } from '@web/features/auth/api/get-me';
import { useBookmarks } from '@web/features/bookmarks/api/get-bookmarks';
import { BookmarkPanel } from '@web/features/bookmarks/components/bookmark-panel';
import { PinMomentButton } from '@web/features/bookmarks/components/pin-moment-button';
import { bundleQueryOptions, useBundle } from '@web/features/bundles/api/get-bundle';
import { bundleReplaysQueryOptions, useBundleReplays } from '@web/features/replays/api/get-bundle-replays';
import { ReplayLauncher } from '@web/features/replays/components/replay-launcher';
import { ReplayList } from '@web/features/replays/components/replay-list';
import { SqlConsolePanel } from '@web/features/sql-console/components/sql-console-panel';
import { useBundleTracks } from '@web/features/workspace/api/get-bundle-tracks';
import { useSaveFigure } from '@web/features/workspace/api/save-figure';
import { ReplayWorkspace } from '@web/features/workspace/components/replay-workspace';
import { ArrowLeft, Columns2, History } from 'lucide-react';
import { useMemo, useState } from 'react';
import { Link, type LoaderFunctionArgs, useNavigate, useParams, useSearchParams } from 'react-router-dom';

export const workspaceLoader =
  (queryClient: QueryClient) =>
  ({ params }: LoaderFunctionArgs) => {
    if (params.bundleId) {
      void queryClient.prefetchQuery(bundleQueryOptions(params.bundleId));
      void queryClient.prefetchQuery(bundleReplaysQueryOptions(params.bundleId));
    }
    return null;
  };

/** The investigator's workspace for one bundle: launch replays, pick one, scrub it. */
export function WorkspaceRoute() {
  const { bundleId = '' } = useParams();
  const [search, setSearch] = useSearchParams();
  const bundle = useBundle(bundleId);
  const replays = useBundleReplays(bundleId);
  const tracks = useBundleTracks(bundleId);
  const items = replays.data?.items ?? [];
  const finished = items.filter((r) => r.status === 'done');
  const chosenId = search.get('replay') ?? finished[0]?.id;
  const chosen = items.find((r) => r.id === chosenId && r.status === 'done');
  const choose = (replayId: string) => setSearch({ replay: replayId }, { replace: false });
  // A deep link (`?replay=…&t=…`) opens the workspace at that moment.
  const linkedTime = search.get('t') === null ? undefined : Number(search.get('t'));
  const deepLinkTime = linkedTime !== undefined && Number.isFinite(linkedTime) ? linkedTime : undefined;
  const bookmarks = useBookmarks(bundle.data?.caseId ?? '');
  const replayBookmarks = useMemo(
    () =>
      (bookmarks.data ?? [])
        .filter((b) => b.replayId === chosenId)
        .map((b) => ({ id: b.id, t: b.t, title: b.note || `Bookmark by ${b.author.name}` })),
    [bookmarks.data, chosenId],
  );
  const bookmarkTimes = useMemo(() => replayBookmarks.map((b) => b.t), [replayBookmarks]);
  const me = useMe();
  const saveFigure = useSaveFigure(bundle.data?.caseId ?? '');
  const navigate = useNavigate();
  // The bookmark being opened restores its step and map view in a fresh workspace.
  const [opened, setOpened] = useState<TBookmark | null>(null);
  const openBookmark = (bookmark: TBookmark) => {
    if (bookmark.bundleId !== bundleId) {
      navigate(paths.workspace.href(bookmark.bundleId, bookmark.replayId, bookmark.t));
      return;
    }
    setOpened(bookmark);
    choose(bookmark.replayId);
  };
  const restoring = opened && opened.replayId === chosen?.id ? opened : null;

  if (bundle.isError)
    return (
      <ErrorState error={bundle.error} title="Could not open this bundle" onRetry={() => bundle.refetch()} />
    );
  if (!bundle.data) return <SkeletonBar className="h-6 w-96" />;
  const caseId = bundle.data.caseId;

  return (
    <>
      <PageHeader
        eyebrow={
          <Link
            to={paths.caseDetail.href(caseId)}
            className="inline-flex items-center gap-1 text-accent hover:underline"
          >
            <ArrowLeft aria-hidden className="size-4" /> Back to the case
          </Link>
        }
        title={`Workspace · ${bundle.data.originalName}`}
        actions={
          finished.length >= 2 && (
            <Link
              to={paths.compareReplays.href(bundleId, finished[1].id, finished[0].id)}
              className="inline-flex items-center gap-1.5 rounded-md border border-canvas-line bg-canvas-raised px-3 py-1.5 text-sm font-bold"
            >
              <Columns2 aria-hidden className="size-4" /> Compare replays
            </Link>
          )
        }
      />
      <details open={!chosen} className="mb-4 rounded-lg border border-canvas-line bg-canvas-raised p-4">
        <summary className="cursor-pointer font-bold">
          Replays ({items.length})
          {chosen && (
            <span className="font-normal text-ink-muted"> · showing {chosen.label || 'untitled replay'}</span>
          )}
        </summary>
        <div className="mt-3 grid grid-cols-2 gap-6">
          <section aria-label="Start a replay">
            <h2 className="mb-2 text-sm font-bold">Start a replay</h2>
            {tracks.isError ? (
              <ErrorState
                error={tracks.error}
                title="Could not read the manifest's settings"
                onRetry={() => tracks.refetch()}
              />
            ) : tracks.data ? (
              <ReplayLauncher
                bundleId={bundleId}
                defaults={tracks.data.filter}
                limits={{ scanBeams: tracks.data.scanBeams ?? null, maxParticles: MAX_PARTICLES }}
                onStarted={(replay) => choose(replay.id)}
              />
            ) : (
              <SkeletonBar className="h-40 w-full" />
            )}
          </section>
          <section aria-label="Replays">
            <h2 className="mb-2 text-sm font-bold">Replays of this bundle</h2>
            {replays.isError ? (
              <ErrorState
                error={replays.error}
                title="Could not load the replays"
                onRetry={() => replays.refetch()}
              />
            ) : replays.data ? (
              <ReplayList replays={items} currentId={chosen?.id} onChoose={choose} />
            ) : (
              <SkeletonBar className="h-20 w-full" />
            )}
          </section>
        </div>
      </details>
      {chosen ? (
        <ReplayWorkspace
          key={`${chosen.id}-${restoring?.id ?? ''}`}
          bundleId={bundleId}
          replay={chosen}
          initialStep={restoring?.step}
          initialTime={restoring ? undefined : deepLinkTime}
          extraMoments={bookmarkTimes}
          bookmarks={replayBookmarks}
          initialView={restoring?.view}
          // Investigators make evidence; the export buttons themselves are for everyone.
          onSavePicture={me.data?.user.role === 'investigator' ? saveFigure : undefined}
          toolbar={(moment) =>
            me.data?.user.role === 'investigator' && (
              <PinMomentButton
                caseId={caseId}
                replayId={moment.replayId}
                step={moment.step}
                t={moment.time}
                view={moment.view ?? { centerX: 0, centerY: 0, zoom: 1 }}
              />
            )
          }
          extraTabs={() => [
            {
              id: 'bookmarks',
              label: 'Bookmarks',
              content: (
                <BookmarkPanel
                  caseId={caseId}
                  onOpen={openBookmark}
                  viewer={me.data ? { id: me.data.user.id, role: me.data.user.role } : undefined}
                />
              ),
            },
            {
              id: 'sql',
              label: 'SQL',
              content: (
                <SqlConsolePanel
                  caseId={caseId}
                  bundleId={bundleId}
                  tables={bundle.data.tables.map((t) => t.name)}
                />
              ),
            },
          ]}
        />
      ) : (
        <EmptyState icon={History} title="No finished replay to show">
          Start a replay above; when it finishes, its map and timeline open here.
        </EmptyState>
      )}
    </>
  );
}
