import { zodResolver } from '@hookform/resolvers/zod';
import { type TLinkFixRequest, ZLinkFixRequest } from '@shared/contracts/fixes';
import { REPLAY_STATUS_LABELS } from '@shared/human-labels';
import { Alert } from '@web/components/alert';
import { Button } from '@web/components/button';
import { type CaseReplays, describeReplay } from '@web/components/case-replays-query';
import { FormField } from '@web/components/form-field';
import { SelectInput, TextArea, TextInput } from '@web/components/inputs';
import { applyServerErrors } from '@web/lib/form-errors';
import { Link2 } from 'lucide-react';
import { useEffect, useId, useState } from 'react';
import { type Resolver, useForm } from 'react-hook-form';
import { useLinkFix } from '../api/link-fix';
import { type RenderReplayLauncher, StartReplayPanel } from './start-replay-panel';

type FixFormValues = Record<
  'url' | 'commitId' | 'description' | 'changedSettings' | 'softwareVersion' | 'verificationReplayId',
  string
>;
const FIELDS = [
  'url',
  'commitId',
  'description',
  'changedSettings',
  'softwareVersion',
  'verificationReplayId',
] as const;
const EMPTY: FixFormValues = Object.fromEntries(FIELDS.map((f) => [f, ''])) as FixFormValues;

/** Empty boxes mean "not given", which the shared schema expresses as an absent field. */
function withoutBlanks(values: FixFormValues): TLinkFixRequest {
  return Object.fromEntries(Object.entries(values).filter(([, v]) => v.trim() !== '')) as TLinkFixRequest;
}

const resolver: Resolver<FixFormValues> = async (values, context, options) => {
  const result = await (zodResolver(ZLinkFixRequest) as unknown as Resolver<FixFormValues>)(
    withoutBlanks(values) as FixFormValues,
    context,
    options,
  );
  return result.errors && Object.keys(result.errors).length > 0 ? result : { values, errors: {} };
};

/** The engineer's form linking a fix, with the replay that should show the problem gone. */
export function LinkFixForm({
  caseId,
  replays,
  renderReplayLauncher,
  onLinked,
}: {
  caseId: string;
  replays?: CaseReplays;
  renderReplayLauncher: RenderReplayLauncher;
  onLinked: () => void;
}) {
  const formId = useId();
  const link = useLinkFix(caseId);
  const form = useForm<FixFormValues>({ resolver, defaultValues: EMPTY });
  const [problem, setProblem] = useState<string>();
  const { errors } = form.formState;
  const choosable = (replays?.replays ?? []).filter((r) => r.status !== 'failed' && r.status !== 'cancelled');
  // A replay just started is picked once its option is on screen (after the list refetches).
  const [startedId, setStartedId] = useState<string>();
  const isStartedListed = Boolean(startedId && choosable.some((r) => r.id === startedId));
  useEffect(() => {
    if (!startedId || !isStartedListed) return;
    form.setValue('verificationReplayId', startedId, { shouldDirty: true });
    setStartedId(undefined);
  }, [startedId, isStartedListed, form]);

  const onSubmit = form.handleSubmit((values) =>
    link.mutate(withoutBlanks(values), {
      onSuccess: () => {
        form.reset(EMPTY);
        onLinked();
      },
      onError: (error) => setProblem(applyServerErrors(error, FIELDS, form.setError)),
    }),
  );

  return (
    // The settings form is a form of its own, so it sits beside this one rather than inside it.
    <div className="space-y-4">
      <form id={formId} onSubmit={onSubmit} noValidate className="space-y-4">
        <div className="grid grid-cols-2 gap-3">
          <FormField
            label="Change request or ticket URL"
            isOptional
            hint="A URL or a commit id is needed."
            error={errors.url?.message}
          >
            {(control) => <TextInput {...control} type="url" {...form.register('url')} />}
          </FormField>
          <FormField label="Commit id" isOptional hint="7 to 64 hex digits." error={errors.commitId?.message}>
            {(control) => <TextInput {...control} {...form.register('commitId')} />}
          </FormField>
        </div>
        <FormField label="Description" error={errors.description?.message}>
          {(control) => <TextArea {...control} className="min-h-16" {...form.register('description')} />}
        </FormField>
        <div className="grid grid-cols-2 gap-3">
          <FormField label="Changed settings" isOptional error={errors.changedSettings?.message}>
            {(control) => (
              <TextArea {...control} className="min-h-16" {...form.register('changedSettings')} />
            )}
          </FormField>
          <FormField label="Software version" isOptional error={errors.softwareVersion?.message}>
            {(control) => <TextInput {...control} {...form.register('softwareVersion')} />}
          </FormField>
        </div>
        <FormField
          label="Verification replay"
          isOptional
          hint="A replay of the incident bundle under the fixed settings."
          error={errors.verificationReplayId?.message}
        >
          {(control) => (
            <SelectInput {...control} {...form.register('verificationReplayId')}>
              <option value="">None</option>
              {choosable.map((r) => (
                <option key={r.id} value={r.id}>
                  {describeReplay(r, replays?.bundles ?? [])}
                  {r.status !== 'done' ? ` (${REPLAY_STATUS_LABELS[r.status].toLowerCase()})` : ''}
                </option>
              ))}
            </SelectInput>
          )}
        </FormField>
      </form>
      <StartReplayPanel
        caseId={caseId}
        replays={replays}
        renderReplayLauncher={renderReplayLauncher}
        onStarted={setStartedId}
      />
      {problem && <Alert title="The fix was not linked">{problem}</Alert>}
      <div className="flex justify-end">
        <Button type="submit" form={formId} variant="primary" icon={Link2} isBusy={link.isPending}>
          Link fix
        </Button>
      </div>
    </div>
  );
}
