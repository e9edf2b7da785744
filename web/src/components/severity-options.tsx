import { SEVERITIES } from '@shared/contracts/cases';
import { SEVERITY_LABELS } from '@shared/human-labels';

/** The `<option>`s of a severity select, mildest first, after an optional empty choice. */
export function SeverityOptions({
  emptyLabel,
  isEmptyDisabled = false,
}: {
  emptyLabel: string;
  isEmptyDisabled?: boolean;
}) {
  return (
    <>
      <option value="" disabled={isEmptyDisabled}>
        {emptyLabel}
      </option>
      {SEVERITIES.map((severity) => (
        <option key={severity} value={severity}>
          {SEVERITY_LABELS[severity]}
        </option>
      ))}
    </>
  );
}
