import type { ReactNode } from 'react';
import { Alert } from './alert';
import { Button } from './button';
import { Dialog } from './dialog';

interface ConfirmDialogProps {
  isOpen: boolean;
  title: string;
  children: ReactNode;
  confirmLabel: string;
  tone?: 'primary' | 'danger';
  isBusy?: boolean;
  errorMessage?: string;
  onConfirm: () => void;
  onCancel: () => void;
}

export function ConfirmDialog({
  isOpen,
  title,
  children,
  confirmLabel,
  tone = 'primary',
  isBusy,
  errorMessage,
  onConfirm,
  onCancel,
}: ConfirmDialogProps) {
  return (
    <Dialog isOpen={isOpen} title={title} onClose={onCancel}>
      <div className="text-sm text-ink">{children}</div>
      {errorMessage && <Alert className="mt-3">{errorMessage}</Alert>}
      <div className="mt-5 flex justify-end gap-2">
        <Button onClick={onCancel}>Cancel</Button>
        <Button variant={tone} onClick={onConfirm} isBusy={isBusy}>
          {confirmLabel}
        </Button>
      </div>
    </Dialog>
  );
}
