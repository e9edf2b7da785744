import { Check, Copy } from 'lucide-react';
import { useState } from 'react';

/** Copies a value (e.g. a SHA-256) to the clipboard and says so. */
export function CopyButton({ value, label }: { value: string; label: string }) {
  const [isCopied, setIsCopied] = useState(false);
  return (
    <button
      type="button"
      aria-label={isCopied ? `${label} copied` : `Copy ${label}`}
      title={isCopied ? 'Copied' : `Copy ${label}`}
      className="inline-flex items-center rounded p-1 text-ink-muted hover:bg-canvas-sunk hover:text-ink"
      onClick={async () => {
        await navigator.clipboard?.writeText(value).catch(() => undefined);
        setIsCopied(true);
        setTimeout(() => setIsCopied(false), 1500);
      }}
    >
      {isCopied ? (
        <Check aria-hidden className="size-4 text-state-ok" />
      ) : (
        <Copy aria-hidden className="size-4" />
      )}
    </button>
  );
}
