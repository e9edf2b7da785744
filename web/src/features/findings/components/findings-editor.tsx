import { zodResolver } from '@hookform/resolvers/zod';
import { INCIDENT_CLASS_LABELS, INCIDENT_CLASSES, type TFindingsResponse } from '@shared/contracts/findings';
import { Alert } from '@web/components/alert';
import { Button } from '@web/components/button';
import { ConfirmDialog } from '@web/components/confirm-dialog';
import { FormField } from '@web/components/form-field';
import { SelectInput, TextArea } from '@web/components/inputs';
import { LocalTime } from '@web/components/local-time';
import { SafetyCautionNote } from '@web/components/safety-caution-note';
import { paths } from '@web/config/paths';
import { applyServerErrors } from '@web/lib/form-errors';
import { Save, Send } from 'lucide-react';
import { useState } from 'react';
import { type Resolver, useForm } from 'react-hook-form';
import { useNavigate } from 'react-router-dom';
import { useSaveFindingsDraft } from '../api/save-findings-draft';
import { useSubmitFindings } from '../api/submit-findings';
import {
  draftFromFormValues,
  type FindingsFormValues,
  formValuesFromDraft,
  ZFindingsForm,
} from '../hooks/findings-form-values';
import { ContributingFactorFields, RootCauseFields } from './cause-fields';
import { CorrectiveActionFields } from './corrective-action-fields';
import { EvidenceFields } from './evidence-fields';

// The resolver checks the complete findings (as submission needs); saving a draft skips it.
const resolver = zodResolver(ZFindingsForm) as unknown as Resolver<FindingsFormValues>;

/** The investigator's findings form: save a draft at any time, submit a complete one for review. */
export function FindingsEditor({ caseId, findings }: { caseId: string; findings: TFindingsResponse }) {
  const navigate = useNavigate();
  const form = useForm<FindingsFormValues>({
    resolver,
    defaultValues: formValuesFromDraft(findings.draft?.content),
  });
  const save = useSaveFindingsDraft(caseId);
  const submit = useSubmitFindings(caseId);
  const [isConfirming, setIsConfirming] = useState(false);
  const [saveProblem, setSaveProblem] = useState<string>();
  const fieldNames = ['summary', 'incidentClass'] as const;

  async function saveDraft(): Promise<boolean> {
    setSaveProblem(undefined);
    try {
      await save.mutateAsync(draftFromFormValues(form.getValues()));
      form.reset(form.getValues());
      return true;
    } catch (error) {
      setSaveProblem(applyServerErrors(error, fieldNames, form.setError));
      return false;
    }
  }

  async function saveAndSubmit() {
    if (!(await saveDraft())) return setIsConfirming(false);
    submit.mutate(undefined, {
      onSuccess: (result) => navigate(paths.caseFindingsVersion.href(caseId, result.version)),
    });
  }

  const { errors } = form.formState;
  return (
    <form onSubmit={form.handleSubmit(() => setIsConfirming(true))} noValidate className="space-y-6">
      <SafetyCautionNote text={findings.safetyCaution} />
      {!findings.canEdit && (
        <Alert title="Editing is not possible now">
          {findings.editBlockedReason ?? 'The case is not open for edits.'}
        </Alert>
      )}
      <fieldset disabled={!findings.canEdit} className="space-y-6">
        <div className="grid grid-cols-[minmax(0,1fr)_16rem] gap-4">
          <FormField
            label="Summary"
            error={errors.summary?.message}
            hint="What happened, for a reader who was not there."
          >
            {(control) => <TextArea {...control} {...form.register('summary')} />}
          </FormField>
          <FormField label="Incident class" error={errors.incidentClass?.message}>
            {(control) => (
              <SelectInput {...control} {...form.register('incidentClass')}>
                <option value="">Choose a class…</option>
                {INCIDENT_CLASSES.map((value) => (
                  <option key={value} value={value}>
                    {INCIDENT_CLASS_LABELS[value]}
                  </option>
                ))}
              </SelectInput>
            )}
          </FormField>
        </div>
        <RootCauseFields form={form} />
        <ContributingFactorFields form={form} />
        <EvidenceFields caseId={caseId} form={form} />
        <CorrectiveActionFields form={form} />
      </fieldset>
      {saveProblem && <Alert title="The draft was not saved">{saveProblem}</Alert>}
      {submit.isError && <Alert title="Not submitted">{submit.error.message}</Alert>}
      <div className="sticky bottom-0 -mx-5 flex items-center justify-end gap-3 border-t border-canvas-line bg-canvas-raised px-5 py-3">
        <p className="mr-auto text-xs text-ink-muted" aria-live="polite">
          {save.isSuccess && !form.formState.isDirty
            ? 'Draft saved.'
            : findings.draft && (
                <>
                  Draft last saved <LocalTime iso={findings.draft.updatedAt} /> by{' '}
                  {findings.draft.updatedBy.name}
                </>
              )}
        </p>
        <Button
          icon={Save}
          onClick={saveDraft}
          isBusy={save.isPending && !isConfirming}
          disabled={!findings.canEdit}
        >
          Save draft
        </Button>
        <Button type="submit" variant="primary" icon={Send} disabled={!findings.canEdit}>
          Submit for review
        </Button>
      </div>
      <ConfirmDialog
        isOpen={isConfirming}
        title="Submit these findings for review?"
        confirmLabel="Submit"
        isBusy={save.isPending || submit.isPending}
        errorMessage={submit.error?.message ?? saveProblem}
        onConfirm={saveAndSubmit}
        onCancel={() => setIsConfirming(false)}
      >
        Submitting freezes this text as a new version and asks a safety reviewer to sign it or send it back.
        Later edits start another version.
      </ConfirmDialog>
    </form>
  );
}
