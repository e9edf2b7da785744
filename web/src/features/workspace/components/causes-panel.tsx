import { CAUSES_CAUTION } from '@shared/causes-caution';
import type { TProbableCause } from '@shared/contracts/replays';
import { CAUSE_KIND_LABELS, labelFor } from '@shared/human-labels';
import { SafetyCautionNote } from '@web/components/safety-caution-note';
import { EmptyState } from '@web/components/states';
import { CircleCheck, CircleMinus, SearchCheck } from 'lucide-react';

interface CausesPanelProps {
  /** Highest confidence first, as served; null while the replay has none. */
  causes: TProbableCause[] | null | undefined;
  onOpen: (time: number) => void;
}

/** A counterfactual value with its sign, or a dash where it could not be measured. */
const formatValue = (value: number | null) => (value === null ? '—' : value.toFixed(3));

function CauseCounterfactuals({ runs }: { runs: TProbableCause['counterfactuals'] }) {
  if (runs.length === 0) return <p className="mt-1 text-xs text-ink-muted">No counterfactual replay.</p>;
  return (
    <ul className="mt-1 space-y-1" aria-label="Counterfactual replays">
      {runs.map((run) => (
        <li key={run.digest} className="rounded bg-canvas-sunk px-2 py-1 text-xs">
          <span className="flex items-center gap-1 font-bold">
            {run.supports ? (
              <CircleCheck aria-hidden className="size-3.5" />
            ) : (
              <CircleMinus aria-hidden className="size-3.5" />
            )}
            {run.supports ? 'Supports' : 'Does not support'}: {run.label}
          </span>
          <span className="block">
            {run.metric}: <span className="tabular-nums">{formatValue(run.value)}</span>
          </span>
          <span className="block font-mono text-ink-muted" title={run.digest}>
            digest {run.digest.slice(0, 16)}…
          </span>
        </li>
      ))}
    </ul>
  );
}

/** The replay's probable causes, highest confidence first; choosing one moves the cursor to its start. */
export function CausesPanel({ causes, onOpen }: CausesPanelProps) {
  if (!causes || causes.length === 0) {
    return (
      <EmptyState icon={SearchCheck} title="No probable causes">
        This replay has no probable causes: it finished before they were computed, or is still running.
      </EmptyState>
    );
  }
  return (
    <div className="space-y-2">
      <SafetyCautionNote text={CAUSES_CAUTION} />
      <ol className="space-y-2" aria-label="Probable causes, most likely first">
        {causes.map((cause) => (
          <li key={`${cause.kind}-${cause.start}`} className="rounded-md bg-canvas-raised p-2 text-sm">
            <button
              type="button"
              onClick={() => onOpen(cause.start)}
              className="w-full text-left hover:bg-canvas-sunk"
            >
              <span className="flex items-center gap-1.5 font-bold">
                {labelFor(CAUSE_KIND_LABELS, cause.kind)}
                <span className="ml-auto text-xs font-normal tabular-nums text-ink-muted">
                  confidence {cause.confidence.toFixed(2)}
                </span>
              </span>
              <span className="mt-1 block h-1 rounded bg-canvas-line" aria-hidden>
                <span className="block h-1 rounded bg-ink" style={{ width: `${cause.confidence * 100}%` }} />
              </span>
              <span className="block text-xs tabular-nums text-ink-muted">
                {cause.start.toFixed(1)}–{cause.end.toFixed(1)} s
              </span>
              <span className="mt-1 block text-xs">{cause.evidence}</span>
              {cause.against && (
                <span className="mt-1 block text-xs text-ink-muted">
                  <span className="font-bold">Against: </span>
                  {cause.against}
                </span>
              )}
            </button>
            <CauseCounterfactuals runs={cause.counterfactuals} />
          </li>
        ))}
      </ol>
    </div>
  );
}
