import type { TBundleStatus } from '@shared/contracts/bundles';
import { CircleCheck, CircleX } from 'lucide-react';

/** Validation status as word and icon, never colour alone. */
export function BundleStatusBadge({ status }: { status: TBundleStatus }) {
  const isValid = status === 'valid';
  const Icon = isValid ? CircleCheck : CircleX;
  return (
    <span
      className={`inline-flex items-center gap-1 text-sm font-bold ${isValid ? 'text-state-ok' : 'text-state-bad'}`}
    >
      <Icon aria-hidden className="size-4" />
      {isValid ? 'Valid' : 'Invalid'}
    </span>
  );
}
