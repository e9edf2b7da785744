import { zodResolver } from '@hookform/resolvers/zod';
import { type TVerifyFixRequest, ZVerifyFixRequest } from '@shared/contracts/fixes';
import type { FixOutcome } from '@shared/fixes/fix-outcome';
import { Alert } from '@web/components/alert';
import { Button } from '@web/components/button';
import { Dialog } from '@web/components/dialog';
import { FormField } from '@web/components/form-field';
import { TextArea } from '@web/components/inputs';
import { BadgeCheck, CircleAlert } from 'lucide-react';
import { useForm } from 'react-hook-form';
import { useVerifyFix } from '../api/verify-fix';

const CONFIRM_NEEDED = 'Tick that you verify the fix although nothing improved, or cancel';

/**
 * Marking a fix verified: a comment saying what was checked, and when the verification replay did
 * not do better than the original, the warning and an explicit confirmation (the API asks for both).
 */
export function VerifyFixDialog({
  caseId,
  fixId,
  outcome,
  onClose,
}: {
  caseId: string;
  fixId: string;
  outcome: FixOutcome;
  onClose: () => void;
}) {
  const verify = useVerifyFix(caseId, fixId);
  const form = useForm<TVerifyFixRequest>({
    resolver: zodResolver(ZVerifyFixRequest),
    defaultValues: { comment: '', confirmWithoutImprovement: false },
  });
  const { errors } = form.formState;
  const onSubmit = form.handleSubmit((body) => {
    if (outcome.kind !== 'improved' && !body.confirmWithoutImprovement) {
      form.setError('confirmWithoutImprovement', { message: CONFIRM_NEEDED });
      return;
    }
    verify.mutate(body, { onSuccess: onClose });
  });
  return (
    <Dialog
      isOpen
      title="Mark the fix verified"
      description="Your comment is kept with the fix and in the case history."
      onClose={onClose}
      widthClassName="w-[34rem]"
    >
      <form onSubmit={onSubmit} noValidate className="space-y-3">
        {outcome.kind === 'improved' ? (
          <Alert tone="info" title="The verification replay improved on the original">
            <ul className="list-disc pl-4">
              {outcome.improvements.map((line) => (
                <li key={line}>{line}</li>
              ))}
            </ul>
          </Alert>
        ) : (
          <Alert tone="warning" title="Nothing improved">
            {outcome.warning}
          </Alert>
        )}
        {verify.isError && <Alert title="Not verified">{verify.error.message}</Alert>}
        <FormField label="What you checked" error={errors.comment?.message}>
          {(control) => <TextArea {...control} {...form.register('comment')} />}
        </FormField>
        {outcome.kind !== 'improved' && (
          <div>
            <label className="flex items-start gap-2 text-sm">
              <input
                type="checkbox"
                className="mt-0.5 size-4"
                aria-invalid={Boolean(errors.confirmWithoutImprovement)}
                {...form.register('confirmWithoutImprovement')}
              />
              <span>I verify this fix although the verification replay shows no improvement.</span>
            </label>
            {errors.confirmWithoutImprovement && (
              <p className="mt-1 flex items-center gap-1 text-xs font-bold text-state-bad">
                <CircleAlert aria-hidden className="size-3.5" />
                {errors.confirmWithoutImprovement.message}
              </p>
            )}
          </div>
        )}
        <div className="flex justify-end gap-2 pt-2">
          <Button onClick={onClose}>Cancel</Button>
          <Button type="submit" variant="primary" icon={BadgeCheck} isBusy={verify.isPending}>
            Mark verified
          </Button>
        </div>
      </form>
    </Dialog>
  );
}
