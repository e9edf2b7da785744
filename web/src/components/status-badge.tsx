import { CASE_STATUS_LABELS, type TCaseStatus } from '@shared/contracts/cases';
import {
  Archive,
  BadgeCheck,
  CircleDot,
  Eye,
  type LucideIcon,
  MessageSquareWarning,
  ScanSearch,
} from 'lucide-react';
import { classNames } from '../lib/class-names';

// Every state has its own icon and word, so the badge reads the same in grey print and for colour-blind users.
const STATUS_STYLE: Record<TCaseStatus, { icon: LucideIcon; className: string }> = {
  open: { icon: CircleDot, className: 'bg-state-info/10 text-state-info ring-state-info/30' },
  analysing: { icon: ScanSearch, className: 'bg-accent-soft text-accent-strong ring-accent/30' },
  in_review: { icon: Eye, className: 'bg-state-warn/10 text-state-warn ring-state-warn/30' },
  changes_requested: {
    icon: MessageSquareWarning,
    className: 'bg-state-bad/10 text-state-bad ring-state-bad/30',
  },
  signed_off: { icon: BadgeCheck, className: 'bg-state-ok/10 text-state-ok ring-state-ok/30' },
  closed: { icon: Archive, className: 'bg-canvas-sunk text-ink-muted ring-canvas-line' },
};

export function CaseStatusBadge({ status }: { status: TCaseStatus }) {
  const { icon: Icon, className } = STATUS_STYLE[status];
  return (
    <span
      className={classNames(
        'inline-flex items-center gap-1 whitespace-nowrap rounded-full px-2 py-0.5 text-xs font-bold ring-1 ring-inset',
        className,
      )}
    >
      <Icon aria-hidden className="size-3.5" />
      {CASE_STATUS_LABELS[status]}
    </span>
  );
}
