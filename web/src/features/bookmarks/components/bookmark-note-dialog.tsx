import { Alert } from '@web/components/alert';
import { Button } from '@web/components/button';
import { Dialog } from '@web/components/dialog';
import { FormField } from '@web/components/form-field';
import { TextArea } from '@web/components/inputs';
import { type ApiError, isApiError } from '@web/lib/api-client';
import { type ReactNode, useEffect, useState } from 'react';

interface BookmarkNoteDialogProps {
  isOpen: boolean;
  title: string;
  description?: ReactNode;
  initialNote?: string;
  submitLabel: string;
  isBusy: boolean;
  error: Error | ApiError | null;
  onSubmit: (note: string) => void;
  onClose: () => void;
}

/** The note of a bookmark, written when pinning and when editing. */
export function BookmarkNoteDialog({
  isOpen,
  title,
  description,
  initialNote = '',
  submitLabel,
  isBusy,
  error,
  onSubmit,
  onClose,
}: BookmarkNoteDialogProps) {
  const [note, setNote] = useState(initialNote);
  useEffect(() => {
    if (isOpen) setNote(initialNote);
  }, [isOpen, initialNote]);
  const noteError = isApiError(error)
    ? error.fieldIssues.find((issue) => issue.path === 'note')?.message
    : undefined;

  return (
    <Dialog isOpen={isOpen} title={title} description={description} onClose={onClose}>
      <form
        onSubmit={(event) => {
          event.preventDefault();
          onSubmit(note.trim());
        }}
      >
        <FormField label="Note" hint="What this moment shows, in a sentence or two" error={noteError}>
          {(control) => (
            <TextArea
              {...control}
              rows={4}
              value={note}
              maxLength={4000}
              onChange={(e) => setNote(e.target.value)}
            />
          )}
        </FormField>
        {error && !noteError && <Alert className="mt-3">{error.message}</Alert>}
        <div className="mt-5 flex justify-end gap-2">
          <Button onClick={onClose}>Cancel</Button>
          <Button type="submit" variant="primary" isBusy={isBusy} disabled={!note.trim()}>
            {submitLabel}
          </Button>
        </div>
      </form>
    </Dialog>
  );
}
