import { CAUSE_CATEGORIES, CAUSE_CATEGORY_LABELS } from '@shared/contracts/findings';
import { FormField } from '@web/components/form-field';
import { SelectInput, TextArea } from '@web/components/inputs';
import { AddRowButton, RemoveRowButton } from '@web/components/row-buttons';
import { type UseFormReturn, useFieldArray } from 'react-hook-form';
import type { FindingsFormValues } from '../hooks/findings-form-values';

type Form = UseFormReturn<FindingsFormValues>;

function CategorySelect(props: React.ComponentProps<typeof SelectInput>) {
  return (
    <SelectInput {...props}>
      <option value="">Choose a category…</option>
      {CAUSE_CATEGORIES.map((category) => (
        <option key={category} value={category}>
          {CAUSE_CATEGORY_LABELS[category]}
        </option>
      ))}
    </SelectInput>
  );
}

export function RootCauseFields({ form }: { form: Form }) {
  const errors = form.formState.errors.rootCause;
  return (
    <fieldset className="grid grid-cols-[16rem_minmax(0,1fr)] gap-3">
      <legend className="mb-2 text-base font-bold">Root cause</legend>
      <FormField label="Root cause category" error={errors?.category?.message}>
        {(control) => <CategorySelect {...control} {...form.register('rootCause.category')} />}
      </FormField>
      <FormField
        label="Root cause explained"
        error={errors?.text?.message}
        hint="What happened and why, in plain words."
      >
        {(control) => <TextArea {...control} className="min-h-20" {...form.register('rootCause.text')} />}
      </FormField>
    </fieldset>
  );
}

export function ContributingFactorFields({ form }: { form: Form }) {
  const factors = useFieldArray({ control: form.control, name: 'contributingFactors' });
  const errors = form.formState.errors.contributingFactors;
  return (
    <fieldset>
      <legend className="mb-2 text-base font-bold">Contributing factors</legend>
      {factors.fields.length === 0 && <p className="mb-2 text-sm text-ink-muted">None listed.</p>}
      <ol className="space-y-3">
        {factors.fields.map((field, index) => (
          <li key={field.id} className="grid grid-cols-[16rem_minmax(0,1fr)_auto] items-start gap-3">
            <FormField label={`Factor ${index + 1} category`} error={errors?.[index]?.category?.message}>
              {(control) => (
                <CategorySelect {...control} {...form.register(`contributingFactors.${index}.category`)} />
              )}
            </FormField>
            <FormField label={`Factor ${index + 1} explained`} error={errors?.[index]?.text?.message}>
              {(control) => (
                <TextArea
                  {...control}
                  className="min-h-10"
                  {...form.register(`contributingFactors.${index}.text`)}
                />
              )}
            </FormField>
            <RemoveRowButton label={`factor ${index + 1}`} onClick={() => factors.remove(index)} />
          </li>
        ))}
      </ol>
      <AddRowButton onClick={() => factors.append({ category: '', text: '' })}>
        Add contributing factor
      </AddRowButton>
    </fieldset>
  );
}
