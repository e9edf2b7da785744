import { FormField } from '@web/components/form-field';
import { TextInput } from '@web/components/inputs';
import { RemoveRowButton } from '@web/components/row-buttons';
import { type UseFormReturn, useFieldArray } from 'react-hook-form';
import type { FindingsFormValues } from '../hooks/findings-form-values';
import { AddEvidenceForm } from './add-evidence-form';
import { EvidenceCitation } from './evidence-citation';

export function EvidenceFields({
  caseId,
  form,
}: {
  caseId: string;
  form: UseFormReturn<FindingsFormValues>;
}) {
  const evidence = useFieldArray({ control: form.control, name: 'evidence' });
  return (
    <fieldset>
      <legend className="mb-2 text-base font-bold">Evidence</legend>
      {evidence.fields.length === 0 && <p className="mb-2 text-sm text-ink-muted">No evidence cited yet.</p>}
      <ol className="mb-3 space-y-2">
        {evidence.fields.map((field, index) => (
          <li
            key={field.id}
            className="grid grid-cols-[minmax(0,1fr)_16rem_auto] items-start gap-3 rounded-md bg-canvas-sunk/50 p-2"
          >
            <EvidenceCitation caseId={caseId} item={form.getValues(`evidence.${index}`)} />
            <FormField label={`Note on evidence ${index + 1}`} isOptional>
              {(control) => <TextInput {...control} {...form.register(`evidence.${index}.note`)} />}
            </FormField>
            <RemoveRowButton label={`evidence ${index + 1}`} onClick={() => evidence.remove(index)} />
          </li>
        ))}
      </ol>
      <AddEvidenceForm caseId={caseId} onAdd={(item) => evidence.append(item)} />
    </fieldset>
  );
}
