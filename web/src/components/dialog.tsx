import { X } from 'lucide-react';
import { type ReactNode, useEffect, useId, useRef } from 'react';

interface DialogProps {
  isOpen: boolean;
  title: string;
  description?: ReactNode;
  onClose: () => void;
  children: ReactNode;
  widthClassName?: string;
}

/**
 * A modal built on the native `<dialog>`: the browser traps focus, closes on Escape and restores focus
 * to the opener, which hand-written overlays often get wrong.
 */
export function Dialog({
  isOpen,
  title,
  description,
  onClose,
  children,
  widthClassName = 'w-[28rem]',
}: DialogProps) {
  const dialogRef = useRef<HTMLDialogElement>(null);
  const titleId = useId();
  const descriptionId = useId();

  useEffect(() => {
    const dialog = dialogRef.current;
    if (!dialog) return;
    if (isOpen && !dialog.open) dialog.showModal();
    if (!isOpen && dialog.open) dialog.close();
  }, [isOpen]);

  return (
    <dialog
      ref={dialogRef}
      aria-labelledby={titleId}
      aria-describedby={description ? descriptionId : undefined}
      onClose={onClose}
      onCancel={(event) => {
        event.preventDefault();
        onClose();
      }}
      className={`m-auto max-w-[calc(100vw-2rem)] rounded-lg bg-canvas-raised p-0 text-ink shadow-2xl ${widthClassName}`}
    >
      {isOpen && (
        <div className="p-5">
          <div className="flex items-start justify-between gap-4">
            <h2 id={titleId} className="text-lg font-bold">
              {title}
            </h2>
            <button
              type="button"
              onClick={onClose}
              aria-label="Close"
              title="Close"
              className="rounded p-1 text-ink-muted hover:bg-canvas-sunk"
            >
              <X aria-hidden className="size-4" />
            </button>
          </div>
          {description && (
            <div id={descriptionId} className="mt-1 text-sm text-ink-muted">
              {description}
            </div>
          )}
          <div className="mt-4">{children}</div>
        </div>
      )}
    </dialog>
  );
}
