import { isReplayLive, type TReplay } from '@shared/contracts/replays';
import { Button } from '@web/components/button';
import { LocalTime } from '@web/components/local-time';
import { EmptyState } from '@web/components/states';
import { Ban, CircleAlert, CircleCheck, Clock, History, LoaderCircle } from 'lucide-react';
import { useCancelReplay } from '../api/cancel-replay';
import { useReplayProgress } from '../api/replay-progress';
import { summarizeOverrides } from './replay-form-values';
import { RerunInBrowser } from './rerun-in-browser';

const STATUS = {
  queued: { icon: Clock, label: 'Queued', tone: 'text-ink-muted' },
  running: { icon: LoaderCircle, label: 'Running', tone: 'text-state-info' },
  done: { icon: CircleCheck, label: 'Done', tone: 'text-state-ok' },
  failed: { icon: CircleAlert, label: 'Failed', tone: 'text-state-bad' },
  cancelled: { icon: Ban, label: 'Cancelled', tone: 'text-ink-muted' },
} as const;

function ReplayProgressBar({ replay }: { replay: TReplay }) {
  const progress = useReplayProgress(replay);
  const fraction = progress && progress.steps > 0 ? progress.step / progress.steps : 0;
  return (
    <div className="mt-1">
      <progress
        className="h-2 w-full accent-series-replay"
        max={1}
        value={fraction}
        aria-label={`Replay progress: ${Math.round(fraction * 100)} %`}
      />
      <span className="text-xs tabular-nums text-ink-muted">
        {progress ? `step ${progress.step} of ${progress.steps}` : 'waiting for a worker…'}
      </span>
    </div>
  );
}

function ReplayRow({
  replay,
  isCurrent,
  onChoose,
}: {
  replay: TReplay;
  isCurrent: boolean;
  onChoose: () => void;
}) {
  const status = STATUS[replay.status];
  const cancel = useCancelReplay(replay.bundleId);
  const isLive = isReplayLive(replay.status);
  return (
    <li
      className={`rounded-md border p-2 text-sm ${isCurrent ? 'border-accent bg-accent-soft' : 'border-canvas-line'}`}
      data-testid="replay-row"
      data-status={replay.status}
    >
      <div className="flex items-center gap-2">
        <status.icon
          aria-hidden
          className={`size-4 ${status.tone} ${replay.status === 'running' ? 'animate-spin' : ''}`}
        />
        <span className={`font-bold ${status.tone}`}>{status.label}</span>
        <span className="truncate font-bold">{replay.label || 'Untitled replay'}</span>
      </div>
      <p className="mt-0.5 text-xs text-ink-muted">{summarizeOverrides(replay.overrides)}</p>
      <p className="text-xs tabular-nums text-ink-muted">
        {replay.digest ? (
          <span title={replay.digest}>digest {replay.digest.slice(0, 12)}…</span>
        ) : (
          'no digest yet'
        )}{' '}
        · {replay.flags.length} flag{replay.flags.length === 1 ? '' : 's'} ·{' '}
        <LocalTime iso={replay.createdAt} />
      </p>
      {replay.error && <p className="text-xs text-state-bad">{replay.error}</p>}
      {isLive && <ReplayProgressBar replay={replay} />}
      {replay.status === 'done' && replay.digest && <RerunInBrowser replay={replay} />}
      <div className="mt-1 flex gap-2">
        {replay.status === 'done' && !isCurrent && (
          <Button size="sm" variant="secondary" onClick={onChoose}>
            Open
          </Button>
        )}
        {isLive && (
          <Button size="sm" icon={Ban} isBusy={cancel.isPending} onClick={() => cancel.mutate(replay.id)}>
            Cancel
          </Button>
        )}
      </div>
    </li>
  );
}

interface ReplayListProps {
  replays: TReplay[];
  currentId: string | undefined;
  onChoose: (replayId: string) => void;
}

/** The bundle's replays, newest first; a finished one can be opened in the workspace. */
export function ReplayList({ replays, currentId, onChoose }: ReplayListProps) {
  if (replays.length === 0) {
    return (
      <EmptyState icon={History} title="No replays yet">
        Start one with the manifest's settings to see what the robot's localization believed.
      </EmptyState>
    );
  }
  return (
    <ul className="space-y-2" aria-label="Replays of this bundle">
      {replays.map((replay) => (
        <ReplayRow
          key={replay.id}
          replay={replay}
          isCurrent={replay.id === currentId}
          onChoose={() => onChoose(replay.id)}
        />
      ))}
    </ul>
  );
}
