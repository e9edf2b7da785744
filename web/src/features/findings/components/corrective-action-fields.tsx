import { FormField } from '@web/components/form-field';
import { TextInput } from '@web/components/inputs';
import { AddRowButton, RemoveRowButton } from '@web/components/row-buttons';
import { type UseFormReturn, useFieldArray } from 'react-hook-form';
import type { FindingsFormValues } from '../hooks/findings-form-values';

export function CorrectiveActionFields({ form }: { form: UseFormReturn<FindingsFormValues> }) {
  const actions = useFieldArray({ control: form.control, name: 'correctiveActions' });
  const errors = form.formState.errors.correctiveActions;
  return (
    <fieldset>
      <legend className="mb-2 text-base font-bold">Corrective actions</legend>
      {actions.fields.length === 0 && <p className="mb-2 text-sm text-ink-muted">None listed.</p>}
      <ol className="space-y-3">
        {actions.fields.map((field, index) => (
          <li key={field.id} className="grid grid-cols-[minmax(0,1fr)_12rem_10rem_auto] items-start gap-3">
            <FormField label={`Corrective action ${index + 1}`} error={errors?.[index]?.description?.message}>
              {(control) => (
                <TextInput {...control} {...form.register(`correctiveActions.${index}.description`)} />
              )}
            </FormField>
            <FormField label={`Owner of action ${index + 1}`} error={errors?.[index]?.owner?.message}>
              {(control) => <TextInput {...control} {...form.register(`correctiveActions.${index}.owner`)} />}
            </FormField>
            <FormField label={`Due date of action ${index + 1}`} error={errors?.[index]?.dueDate?.message}>
              {(control) => (
                <TextInput
                  type="date"
                  {...control}
                  {...form.register(`correctiveActions.${index}.dueDate`)}
                />
              )}
            </FormField>
            <RemoveRowButton label={`action ${index + 1}`} onClick={() => actions.remove(index)} />
          </li>
        ))}
      </ol>
      <AddRowButton onClick={() => actions.append({ description: '', owner: '', dueDate: '' })}>
        Add corrective action
      </AddRowButton>
    </fieldset>
  );
}
