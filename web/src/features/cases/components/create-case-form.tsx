import { zodResolver } from '@hookform/resolvers/zod';
import type { TCase } from '@shared/contracts/cases';
import { describeTimeZone } from '@shared/site-time';
import { Alert } from '@web/components/alert';
import { Button } from '@web/components/button';
import { FormField } from '@web/components/form-field';
import { SelectInput, TextArea, TextInput } from '@web/components/inputs';
import { SeverityOptions } from '@web/components/severity-options';
import { applyServerErrors } from '@web/lib/form-errors';
import { useSiteTimeZone } from '@web/lib/site-time-zone';
import { Save } from 'lucide-react';
import { useMemo, useState } from 'react';
import { useForm } from 'react-hook-form';
import { useCreateCase } from '../api/create-case';
import {
  CREATE_CASE_FIELDS,
  createCaseFormSchema,
  type TCreateCaseFormInput,
  type TCreateCaseFormOutput,
} from '../hooks/create-case-form-schema';

interface CreateCaseFormProps {
  onCreated: (created: TCase) => void;
  onCancel: () => void;
}

export function CreateCaseForm({ onCreated, onCancel }: CreateCaseFormProps) {
  const createCase = useCreateCase();
  const [formError, setFormError] = useState<string>();
  const siteTimeZone = useSiteTimeZone();
  const schema = useMemo(() => createCaseFormSchema(siteTimeZone), [siteTimeZone]);
  const form = useForm<TCreateCaseFormInput, unknown, TCreateCaseFormOutput>({
    resolver: zodResolver(schema),
    defaultValues: { title: '', site: '', robotId: '', incidentTime: '', severity: '' as never, summary: '' },
  });
  const { errors } = form.formState;

  const submit = form.handleSubmit((values) => {
    setFormError(undefined);
    createCase.mutate(values, {
      onSuccess: onCreated,
      onError: (error) => setFormError(applyServerErrors(error, CREATE_CASE_FIELDS, form.setError)),
    });
  });

  return (
    <form onSubmit={submit} noValidate className="space-y-5">
      {formError && <Alert title="The case was not created">{formError}</Alert>}
      <FormField label="Title" hint="What happened, in a few words." error={errors.title?.message}>
        {(control) => (
          <TextInput {...control} {...form.register('title')} placeholder="Tug stopped short of dock 4" />
        )}
      </FormField>
      <div className="grid grid-cols-2 gap-4">
        <FormField
          label="Site"
          hint="Where it happened: site, then hall or area."
          error={errors.site?.message}
        >
          {(control) => <TextInput {...control} {...form.register('site')} placeholder="Harbourside depot" />}
        </FormField>
        <FormField
          label="Robot id"
          hint="As printed on the robot or in its logs."
          error={errors.robotId?.message}
        >
          {(control) => <TextInput {...control} {...form.register('robotId')} placeholder="AMR-07" />}
        </FormField>
      </div>
      <div className="grid grid-cols-2 gap-4">
        <FormField
          label="Incident time"
          hint={`Site time, ${describeTimeZone(siteTimeZone)}; stored with its UTC offset.`}
          error={errors.incidentTime?.message}
        >
          {(control) => (
            <TextInput {...control} type="datetime-local" step={1} {...form.register('incidentTime')} />
          )}
        </FormField>
        <FormField
          label="Severity"
          hint="Your first assessment; it can change later."
          error={errors.severity?.message}
        >
          {(control) => (
            <SelectInput {...control} {...form.register('severity')}>
              <SeverityOptions emptyLabel="Choose…" isEmptyDisabled />
            </SelectInput>
          )}
        </FormField>
      </div>
      <FormField
        label="Summary"
        isOptional
        hint="What is known so far: who reported it, what was seen, what was stopped."
        error={errors.summary?.message}
      >
        {(control) => <TextArea {...control} rows={5} {...form.register('summary')} />}
      </FormField>
      <div className="flex justify-end gap-2 border-t border-canvas-line pt-4">
        <Button onClick={onCancel}>Cancel</Button>
        <Button type="submit" variant="primary" icon={Save} isBusy={createCase.isPending}>
          Create case
        </Button>
      </div>
    </form>
  );
}
