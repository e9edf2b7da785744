import { type InputHTMLAttributes, useEffect, useState } from 'react';
import { TextInput } from './inputs';

interface DebouncedTextInputProps extends Omit<InputHTMLAttributes<HTMLInputElement>, 'value' | 'onChange'> {
  value: string;
  onValueChange: (value: string) => void;
  delayMs?: number;
}

/** A text box that reports its value after typing pauses, so each keystroke does not fire a request. */
export function DebouncedTextInput({
  value,
  onValueChange,
  delayMs = 300,
  ...rest
}: DebouncedTextInputProps) {
  const [draft, setDraft] = useState(value);

  // Follow outside changes (clearing filters, back button) without fighting the person typing.
  useEffect(() => setDraft(value), [value]);

  useEffect(() => {
    if (draft === value) return;
    const timer = setTimeout(() => onValueChange(draft), delayMs);
    return () => clearTimeout(timer);
  }, [draft, value, delayMs, onValueChange]);

  return <TextInput value={draft} onChange={(event) => setDraft(event.target.value)} {...rest} />;
}
