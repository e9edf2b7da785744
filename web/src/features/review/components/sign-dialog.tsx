import { zodResolver } from '@hookform/resolvers/zod';
import { ZSignoffRequest } from '@shared/contracts/findings';
import { REVIEW_WORDS } from '@shared/review-words';
import { Alert } from '@web/components/alert';
import { Button } from '@web/components/button';
import { Dialog } from '@web/components/dialog';
import { SafetyCautionNote } from '@web/components/safety-caution-note';
import { CircleAlert, FileSignature } from 'lucide-react';
import { useForm } from 'react-hook-form';
import { useSignVersion } from '../api/sign-version';

interface SignDialogProps {
  caseId: string;
  version: number;
  caution: string;
  onClose: () => void;
}

/** Signing needs the reviewer to confirm reading the caution, the same rule the server enforces. */
export function SignDialog({ caseId, version, caution, onClose }: SignDialogProps) {
  const sign = useSignVersion(caseId, version);
  const form = useForm<{ acknowledgeCaution: boolean }>({
    resolver: zodResolver(ZSignoffRequest) as never,
    defaultValues: { acknowledgeCaution: false },
  });
  const error = form.formState.errors.acknowledgeCaution?.message;
  return (
    <Dialog
      isOpen
      title={REVIEW_WORDS.signOffTitle(version)}
      description="Your signature is recorded against the exact text of this version. Any later edit needs a new signature."
      onClose={onClose}
      widthClassName="w-[34rem]"
    >
      <form onSubmit={form.handleSubmit(() => sign.mutate(undefined, { onSuccess: onClose }))} noValidate>
        <SafetyCautionNote text={caution} />
        <label className="mt-3 flex items-start gap-2 text-sm">
          <input
            type="checkbox"
            className="mt-0.5 size-4"
            aria-invalid={Boolean(error)}
            {...form.register('acknowledgeCaution')}
          />
          <span>I have read this safety caution.</span>
        </label>
        {error && (
          <p className="mt-1 flex items-center gap-1 text-xs font-bold text-state-bad">
            <CircleAlert aria-hidden className="size-3.5" />
            {error}
          </p>
        )}
        {sign.isError && (
          <Alert className="mt-3" title="Not signed off">
            {sign.error.message}
          </Alert>
        )}
        <div className="mt-5 flex justify-end gap-2">
          <Button onClick={onClose}>Cancel</Button>
          <Button type="submit" variant="primary" icon={FileSignature} isBusy={sign.isPending}>
            {REVIEW_WORDS.signOffButton(version)}
          </Button>
        </div>
      </form>
    </Dialog>
  );
}
