import { SAVED_QUERY_PREVIEW_ROWS } from '@shared/contracts/saved-queries';
import { queryResultSha256 } from '@shared/query-result-hash';
import { Alert } from '@web/components/alert';
import { Button } from '@web/components/button';
import { Dialog } from '@web/components/dialog';
import { FormField } from '@web/components/form-field';
import { TextInput } from '@web/components/inputs';
import { isApiError } from '@web/lib/api-client';
import { useMemo, useState } from 'react';
import { useCreateSavedQuery } from '../api/create-saved-query';
import type { QueryResult } from '../lib/query-result';

interface SaveQueryDialogProps {
  isOpen: boolean;
  caseId: string;
  bundleId: string;
  sql: string;
  result: QueryResult;
  onClose: () => void;
}

/** Saves the query with the SHA-256 of its canonical result, so a finding can cite it. */
export function SaveQueryDialog({ isOpen, caseId, bundleId, sql, result, onClose }: SaveQueryDialogProps) {
  const [title, setTitle] = useState('');
  const save = useCreateSavedQuery(caseId);
  const columns = useMemo(() => result.columns.map((c) => c.name), [result]);
  // About 0.4 s per 100,000 rows of four columns, so hash once per result, not per keystroke.
  const resultSha256 = useMemo(
    () => (isOpen ? queryResultSha256(columns, result.rows) : ''),
    [isOpen, columns, result],
  );
  const titleError = isApiError(save.error)
    ? save.error.fieldIssues.find((issue) => issue.path === 'title')?.message
    : undefined;

  const submit = () => {
    save.mutate(
      {
        bundleId,
        title: title.trim(),
        sql,
        resultSha256,
        rowCount: result.rows.length,
        columns,
        preview: result.rows.slice(0, SAVED_QUERY_PREVIEW_ROWS),
      },
      {
        onSuccess: () => {
          setTitle('');
          save.reset();
          onClose();
        },
      },
    );
  };

  return (
    <Dialog
      isOpen={isOpen}
      title="Save to case as evidence"
      description="The query text, its row count and the SHA-256 of its result are stored on the case."
      onClose={onClose}
    >
      <form
        onSubmit={(event) => {
          event.preventDefault();
          submit();
        }}
      >
        <FormField
          label="Title"
          hint="What the result shows, e.g. Odometry jump at 41.2 s"
          error={titleError}
        >
          {(control) => (
            <TextInput
              {...control}
              value={title}
              required
              maxLength={200}
              onChange={(e) => setTitle(e.target.value)}
            />
          )}
        </FormField>
        <p className="mt-3 text-xs text-ink-muted">
          {result.rows.length} rows · result SHA-256{' '}
          <code className="break-all font-mono text-ink">{resultSha256}</code>
        </p>
        {save.error && <Alert className="mt-3">{save.error.message}</Alert>}
        <div className="mt-5 flex justify-end gap-2">
          <Button onClick={onClose}>Cancel</Button>
          <Button type="submit" variant="primary" isBusy={save.isPending} disabled={!title.trim()}>
            Save query
          </Button>
        </div>
      </form>
    </Dialog>
  );
}
