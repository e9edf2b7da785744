import type { TReplayFlag } from '@shared/contracts/replays';
import { FLAG_KIND_LABELS, FLAG_SEVERITY_LABELS, labelFor } from '@shared/human-labels';
import { EmptyState } from '@web/components/states';
import { Flag, ShieldCheck } from 'lucide-react';

interface FlagsPanelProps {
  flags: TReplayFlag[];
  onOpen: (time: number) => void;
}

const SEVERITY_STYLE = {
  info: 'border-series-flag/30',
  warning: 'border-series-flag/60',
  critical: 'border-series-flag',
} as const;

/** The replay's flags in time order; choosing one moves the cursor to its start. */
export function FlagsPanel({ flags, onOpen }: FlagsPanelProps) {
  if (flags.length === 0) {
    return (
      <EmptyState icon={ShieldCheck} title="No flags">
        The engine found nothing worth attention in this replay.
      </EmptyState>
    );
  }
  const sorted = [...flags].sort((a, b) => a.start - b.start);
  return (
    <ul className="space-y-2" aria-label="Flags in this replay">
      {sorted.map((flag) => (
        <li key={`${flag.kind}-${flag.start}-${flag.end}`}>
          <button
            type="button"
            onClick={() => onOpen(flag.start)}
            className={`w-full rounded-md border-l-4 bg-canvas-raised p-2 text-left text-sm hover:bg-canvas-sunk ${SEVERITY_STYLE[flag.severity]}`}
          >
            <span className="flex items-center gap-1.5 font-bold">
              <Flag aria-hidden className="size-4 text-series-flag" />
              {labelFor(FLAG_KIND_LABELS, flag.kind)}
              <span className="ml-auto text-xs font-normal uppercase text-ink-muted">
                {FLAG_SEVERITY_LABELS[flag.severity]}
              </span>
            </span>
            <span className="block text-xs tabular-nums text-ink-muted">
              {flag.start.toFixed(1)}–{flag.end.toFixed(1)} s
            </span>
            <span className="mt-1 block text-xs">{flag.evidence}</span>
          </button>
        </li>
      ))}
    </ul>
  );
}
