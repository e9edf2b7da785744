import type { EvidenceNames } from '@shared/evidence-names';
import { FormField } from '@web/components/form-field';
import { SelectInput } from '@web/components/inputs';
import { apiPaths } from '@web/config/paths';

/** Chooses one of the case's saved pictures by its caption, showing the chosen one. */
export function FigurePicker({
  figures,
  value,
  onChange,
}: {
  figures: EvidenceNames['figures'] | undefined;
  value: string;
  onChange: (figureId: string) => void;
}) {
  const chosen = figures?.get(value);
  const isEmpty = figures !== undefined && figures.size === 0;
  return (
    <FormField
      label="Figure"
      hint={
        isEmpty
          ? 'No figures yet: in the workspace, use "Save map to case" or "Save timeline to case".'
          : chosen
            ? `SHA-256 ${chosen.sha256}`
            : 'Pictures saved to this case from the workspace.'
      }
    >
      {(control) => (
        <>
          <SelectInput {...control} value={value} onChange={(e) => onChange(e.target.value)}>
            <option value="">{figures ? 'Choose a figure…' : 'Loading figures…'}</option>
            {[...(figures?.entries() ?? [])].map(([id, figure]) => (
              <option key={id} value={id}>
                {figure.caption}
              </option>
            ))}
          </SelectInput>
          {chosen && (
            <img
              src={apiPaths.figureFile(value)}
              alt={`Figure: ${chosen.caption}`}
              className="mt-2 max-h-32 max-w-full rounded border border-canvas-line bg-white"
            />
          )}
        </>
      )}
    </FormField>
  );
}
