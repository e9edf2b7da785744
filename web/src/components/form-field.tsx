import { CircleAlert } from 'lucide-react';
import { type ReactNode, useId } from 'react';

export interface FieldControlProps {
  id: string;
  'aria-invalid': boolean;
  'aria-describedby'?: string;
}

interface FormFieldProps {
  label: string;
  /** Shown under the label; say the unit or format here. */
  hint?: ReactNode;
  error?: string;
  isOptional?: boolean;
  className?: string;
  /** Receives the ids that tie the control to its label, hint and error. */
  children: (control: FieldControlProps) => ReactNode;
}

/** Label, hint, control and error message wired together for screen readers. */
export function FormField({ label, hint, error, isOptional, className, children }: FormFieldProps) {
  const id = useId();
  const hintId = hint ? `${id}-hint` : undefined;
  const errorId = error ? `${id}-error` : undefined;
  const describedBy = [hintId, errorId].filter(Boolean).join(' ') || undefined;
  return (
    <div className={className}>
      <label htmlFor={id} className="block text-sm font-bold text-ink">
        {label}
        {isOptional && <span className="ml-1 font-normal text-ink-muted">(optional)</span>}
      </label>
      {hint && (
        <p id={hintId} className="mt-0.5 text-xs text-ink-muted">
          {hint}
        </p>
      )}
      <div className="mt-1">
        {children({ id, 'aria-invalid': Boolean(error), 'aria-describedby': describedBy })}
      </div>
      {error && (
        <p id={errorId} className="mt-1 flex items-center gap-1 text-xs font-bold text-state-bad">
          <CircleAlert aria-hidden className="size-3.5 shrink-0" />
          {error}
        </p>
      )}
    </div>
  );
}
