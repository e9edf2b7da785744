import { zodResolver } from '@hookform/resolvers/zod';
import { ZReturnRequest } from '@shared/contracts/findings';
import { REVIEW_WORDS } from '@shared/review-words';
import { Alert } from '@web/components/alert';
import { Button } from '@web/components/button';
import { Dialog } from '@web/components/dialog';
import { FormField } from '@web/components/form-field';
import { TextArea } from '@web/components/inputs';
import { useForm } from 'react-hook-form';
import { type TReturnRequest, useReturnVersion } from '../api/return-version';

export function RequestChangesDialog({
  caseId,
  version,
  onClose,
}: {
  caseId: string;
  version: number;
  onClose: () => void;
}) {
  const sendBack = useReturnVersion(caseId, version);
  const form = useForm<TReturnRequest>({
    resolver: zodResolver(ZReturnRequest),
    defaultValues: { comment: '' },
  });
  return (
    <Dialog
      isOpen
      title={REVIEW_WORDS.returnTitle(version)}
      description="The author gets your comment by e-mail and in the case history."
      onClose={onClose}
    >
      <form onSubmit={form.handleSubmit((body) => sendBack.mutate(body, { onSuccess: onClose }))} noValidate>
        <FormField label={REVIEW_WORDS.commentsLabel} error={form.formState.errors.comment?.message}>
          {(control) => <TextArea {...control} {...form.register('comment')} />}
        </FormField>
        {sendBack.isError && (
          <Alert className="mt-3" title="Not returned">
            {sendBack.error.message}
          </Alert>
        )}
        <div className="mt-5 flex justify-end gap-2">
          <Button onClick={onClose}>Cancel</Button>
          <Button type="submit" variant="danger" isBusy={sendBack.isPending}>
            {REVIEW_WORDS.returnButton}
          </Button>
        </div>
      </form>
    </Dialog>
  );
}
