import type { TBookmark } from '@shared/contracts/bookmarks';
import type { Role } from '@shared/roles';
import { Button } from '@web/components/button';
import { ConfirmDialog } from '@web/components/confirm-dialog';
import { LocalTime } from '@web/components/local-time';
import { EmptyState, ErrorState, SkeletonBar } from '@web/components/states';
import { Bookmark, Crosshair, Pencil, Trash2 } from 'lucide-react';
import { useState } from 'react';
import { useDeleteBookmark } from '../api/delete-bookmark';
import { useBookmarks } from '../api/get-bookmarks';
import { useUpdateBookmark } from '../api/update-bookmark';
import { BookmarkNoteDialog } from './bookmark-note-dialog';

interface BookmarkPanelProps {
  caseId: string;
  /** Restores the bookmark's replay, step and map view. */
  onOpen: (bookmark: TBookmark) => void;
  /** The signed-in person; when given, edit shows for the author or an admin and delete for the author. */
  viewer?: { id: string; role: Role };
}

/** The case's bookmarks: open one to return to its moment, edit its note, or delete it. */
export function BookmarkPanel({ caseId, onOpen, viewer }: BookmarkPanelProps) {
  const bookmarks = useBookmarks(caseId);
  const update = useUpdateBookmark(caseId);
  const remove = useDeleteBookmark(caseId);
  const [editing, setEditing] = useState<TBookmark | null>(null);
  const [deleting, setDeleting] = useState<TBookmark | null>(null);

  const isAuthor = (bookmark: TBookmark) => !viewer || viewer.id === bookmark.author.id;
  const canEdit = (bookmark: TBookmark) => isAuthor(bookmark) || viewer?.role === 'admin';

  if (bookmarks.isPending) return <SkeletonBar className="w-48" />;
  if (bookmarks.isError)
    return (
      <ErrorState error={bookmarks.error} title="Could not load bookmarks" onRetry={bookmarks.refetch} />
    );
  if (!bookmarks.data.length)
    return (
      <EmptyState icon={Bookmark} title="No bookmarks yet">
        Pin a moment of a replay to keep it as evidence for the findings.
      </EmptyState>
    );

  return (
    <section aria-label="Bookmarks">
      <ul className="divide-y divide-canvas-line">
        {bookmarks.data.map((bookmark) => (
          <li key={bookmark.id} className="py-2">
            <p className="text-sm text-ink">{bookmark.note}</p>
            <p className="mt-0.5 text-xs text-ink-muted tabular-nums">
              {bookmark.replayLabel || 'Replay'} · step {bookmark.step} · {bookmark.t.toFixed(2)}{' '}
              <span className="font-normal">s</span>
            </p>
            <p className="text-xs text-ink-muted">
              <span className="font-mono" title={`Replay digest ${bookmark.replayDigest}`}>
                digest {bookmark.replayDigest.slice(0, 12)}…
              </span>{' '}
              · {bookmark.author.name} · <LocalTime iso={bookmark.createdAt} />
            </p>
            <div className="mt-1 flex gap-1">
              <Button
                size="sm"
                variant="ghost"
                icon={Crosshair}
                aria-label={`Open bookmark: ${bookmark.note}`}
                onClick={() => onOpen(bookmark)}
              >
                Open
              </Button>
              {canEdit(bookmark) && (
                <Button
                  size="sm"
                  variant="ghost"
                  icon={Pencil}
                  aria-label={`Edit note: ${bookmark.note}`}
                  onClick={() => setEditing(bookmark)}
                >
                  Edit note
                </Button>
              )}
              {isAuthor(bookmark) && (
                <Button
                  size="sm"
                  variant="ghost"
                  icon={Trash2}
                  aria-label={`Delete bookmark: ${bookmark.note}`}
                  onClick={() => setDeleting(bookmark)}
                >
                  Delete
                </Button>
              )}
            </div>
          </li>
        ))}
      </ul>
      <BookmarkNoteDialog
        isOpen={editing !== null}
        title="Edit bookmark note"
        initialNote={editing?.note ?? ''}
        submitLabel="Save note"
        isBusy={update.isPending}
        error={update.error}
        onSubmit={(note) =>
          editing && update.mutate({ bookmarkId: editing.id, note }, { onSuccess: () => setEditing(null) })
        }
        onClose={() => {
          setEditing(null);
          update.reset();
        }}
      />
      <ConfirmDialog
        isOpen={deleting !== null}
        title="Delete bookmark?"
        confirmLabel="Delete bookmark"
        tone="danger"
        isBusy={remove.isPending}
        errorMessage={remove.error?.message}
        onConfirm={() => deleting && remove.mutate(deleting.id, { onSuccess: () => setDeleting(null) })}
        onCancel={() => {
          setDeleting(null);
          remove.reset();
        }}
      >
        The bookmark “{deleting?.note}” is removed from the case. Bookmarks cited by submitted findings, or on
        a case under legal hold, are kept.
      </ConfirmDialog>
    </section>
  );
}
