import type { TBundleStatus } from '@shared/contracts/bundles';
import { BUNDLE_STATUS_LABELS } from '@shared/human-labels';
import { CircleCheck, CircleX, Hourglass, type LucideIcon } from 'lucide-react';

const LOOK: Record<TBundleStatus, { icon: LucideIcon; className: string }> = {
  valid: { icon: CircleCheck, className: 'text-state-ok' },
  invalid: { icon: CircleX, className: 'text-state-bad' },
  validating: { icon: Hourglass, className: 'text-ink-muted' },
};

/** Validation status as word and icon, never colour alone. */
export function BundleStatusBadge({ status }: { status: TBundleStatus }) {
  const { icon: Icon, className } = LOOK[status];
  return (
    <span className={`inline-flex items-center gap-1 text-sm font-bold ${className}`}>
      <Icon aria-hidden className="size-4" />
      {BUNDLE_STATUS_LABELS[status]}
    </span>
  );
}
