import type { TBookmarkView } from '@shared/contracts/bookmarks';
import { Button } from '@web/components/button';
import { Pin } from 'lucide-react';
import { useState } from 'react';
import { useCreateBookmark } from '../api/create-bookmark';
import { BookmarkNoteDialog } from './bookmark-note-dialog';

interface PinMomentButtonProps {
  caseId: string;
  replayId: string;
  step: number;
  /** s since the bundle's start_time */
  t: number;
  view: TBookmarkView;
  onPinned?: () => void;
}

/** Pins the current replay moment and map view to the case as a bookmark, with a note. */
export function PinMomentButton({ caseId, replayId, step, t, view, onPinned }: PinMomentButtonProps) {
  const [isOpen, setIsOpen] = useState(false);
  const create = useCreateBookmark(caseId);
  const close = () => {
    setIsOpen(false);
    create.reset();
  };
  return (
    <>
      <Button size="sm" icon={Pin} onClick={() => setIsOpen(true)}>
        Pin this moment
      </Button>
      <BookmarkNoteDialog
        isOpen={isOpen}
        title="Pin this moment"
        description={
          <span className="tabular-nums">
            Step {step} at {t.toFixed(2)} <span className="font-normal">s</span>; the map view is saved with
            it.
          </span>
        }
        submitLabel="Save bookmark"
        isBusy={create.isPending}
        error={create.error}
        onSubmit={(note) =>
          create.mutate(
            { replayId, step, t, view, note },
            {
              onSuccess: () => {
                close();
                onPinned?.();
              },
            },
          )
        }
        onClose={close}
      />
    </>
  );
}
