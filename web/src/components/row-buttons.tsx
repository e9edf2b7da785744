import { Plus, Trash2 } from 'lucide-react';
import type { ReactNode } from 'react';
import { Button } from './button';

/** The icon button that removes one row of a repeated form group; `label` names the row. */
export function RemoveRowButton({ label, onClick }: { label: string; onClick: () => void }) {
  return (
    <Button
      className="mt-6"
      icon={Trash2}
      aria-label={`Remove ${label}`}
      title={`Remove ${label}`}
      onClick={onClick}
    />
  );
}

/** The button under a repeated form group that adds one more row. */
export function AddRowButton({ onClick, children }: { onClick: () => void; children: ReactNode }) {
  return (
    <Button size="sm" className="mt-2" icon={Plus} onClick={onClick}>
      {children}
    </Button>
  );
}
