import type { InputHTMLAttributes, SelectHTMLAttributes, TextareaHTMLAttributes } from 'react';
import { classNames } from '../lib/class-names';

// One look for every text control; aria-invalid drives the error border so state is not colour alone
// (the FormField adds an icon and a message).
const CONTROL =
  'w-full rounded-md border border-canvas-line bg-canvas-raised px-3 text-sm text-ink placeholder:text-ink-faint ' +
  'hover:border-ink-faint aria-[invalid=true]:border-state-bad aria-[invalid=true]:border-2 disabled:bg-canvas-sunk';

export function TextInput({ className, ...rest }: InputHTMLAttributes<HTMLInputElement>) {
  return <input className={classNames(CONTROL, 'h-10', className)} {...rest} />;
}

interface SelectInputProps extends SelectHTMLAttributes<HTMLSelectElement> {
  /** `compact` fits inside table rows and toolbars. */
  density?: 'regular' | 'compact';
}

export function SelectInput({ className, density = 'regular', ...rest }: SelectInputProps) {
  return (
    <select
      className={classNames(CONTROL, density === 'compact' ? 'h-8 pr-6' : 'h-10 pr-8', className)}
      {...rest}
    />
  );
}

export function TextArea({ className, ...rest }: TextareaHTMLAttributes<HTMLTextAreaElement>) {
  return <textarea className={classNames(CONTROL, 'min-h-28 py-2', className)} {...rest} />;
}
