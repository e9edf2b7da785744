import type { TReplayFlag } from '@shared/contracts/replays';
import { FLAG_KIND_LABELS, FLAG_SEVERITY_LABELS, labelFor } from '@shared/human-labels';
import { InfoButton } from '@web/components/info-button';
import { EmptyState } from '@web/components/states';
import { Flag, ShieldCheck } from 'lucide-react';
import { FlagSightings } from './flag-sightings';

interface FlagsPanelProps {
  flags: TReplayFlag[];
  /** Cursor time (s): which sighting of a gathered flag is on screen. */
  time: number;
  onOpen: (time: number) => void;
}

/** What each severity asks of the investigator (docs/flags.md, "Severity ladder"). */
const SEVERITY_LADDER = 'info: context · warning: look at it · critical: explain it in the findings';

const SEVERITY_STYLE = {
  info: 'border-series-flag/30',
  warning: 'border-series-flag/60',
  critical: 'border-series-flag',
} as const;

/** The replay's flags in time order; choosing one moves the cursor to its start. */
export function FlagsPanel({ flags, time, onOpen }: FlagsPanelProps) {
  if (flags.length === 0) {
    return (
      <EmptyState icon={ShieldCheck} title="No flags">
        The engine found nothing worth attention in this replay.
      </EmptyState>
    );
  }
  const sorted = [...flags].sort((a, b) => a.start - b.start);
  return (
    <div>
      <p className="mb-2 text-xs text-ink-muted">{SEVERITY_LADDER}</p>
      <ul className="space-y-2" aria-label="Flags in this replay">
        {sorted.map((flag) => (
          <li
            key={`${flag.kind}-${flag.start}-${flag.end}`}
            className={`relative rounded-md border-l-4 bg-canvas-raised p-2 text-sm ${SEVERITY_STYLE[flag.severity]}`}
          >
            <button
              type="button"
              onClick={() => onOpen(flag.start)}
              className="w-full text-left hover:bg-canvas-sunk"
            >
              <span className="flex items-center gap-1.5 font-bold">
                <Flag aria-hidden className="size-4 text-series-flag" />
                {/* Room on the right for the info buttons laid over the row, so they never cover the words. */}
                <span className="min-w-0 flex-1 pr-12" data-testid="flag-title">
                  {labelFor(FLAG_KIND_LABELS, flag.kind)}
                </span>
                <span className="ml-auto text-xs font-normal uppercase text-ink-muted">
                  {FLAG_SEVERITY_LABELS[flag.severity]}
                </span>
              </span>
              <span className="block text-xs tabular-nums text-ink-muted">
                {flag.start.toFixed(1)}–{flag.end.toFixed(1)} s
              </span>
              <span className="mt-1 block text-xs">{flag.evidence}</span>
            </button>
            {/* Beside the button, not in it: a button cannot hold another. */}
            <span className="absolute top-2.5 right-20 flex gap-1">
              <InfoButton term={flag.kind} />
              {/NEES/.test(flag.evidence) && <InfoButton term="nees" />}
            </span>
            {flag.sightings && flag.sightings.length > 1 && (
              <FlagSightings sightings={flag.sightings} time={time} onOpen={onOpen} />
            )}
          </li>
        ))}
      </ul>
    </div>
  );
}
