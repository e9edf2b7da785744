import type { TReplay } from '@shared/contracts/replays';
import { DIGEST_LAYOUT } from '@shared/engine/engine-version';
import { Button } from '@web/components/button';
import { CircleAlert, CircleCheck, MonitorPlay, X } from 'lucide-react';
import { useRerunInBrowser } from '../hooks/use-rerun-in-browser';

/**
 * "Re-run in this browser": an independent check of a finished replay's digest, computed here
 * by the same engine (its own elementary functions make the digest identical on any JavaScript
 * engine) instead of trusting the server's.
 */
export function RerunInBrowser({ replay }: { replay: TReplay }) {
  const { state, start, cancel } = useRerunInBrowser(replay);
  const recordedLayout = replay.engine?.digestLayout ?? 1;
  const isBusy = state.phase === 'downloading' || state.phase === 'running';
  return (
    <div className="mt-1" data-testid="rerun-in-browser">
      {!isBusy && (
        <Button size="sm" variant="secondary" icon={MonitorPlay} onClick={start}>
          {state.phase === 'idle' ? 'Re-run in this browser' : 'Re-run again'}
        </Button>
      )}
      {isBusy && (
        <div className="flex items-center gap-2">
          <progress
            className="h-2 w-full accent-series-replay"
            max={1}
            value={state.phase === 'running' && state.steps > 0 ? state.step / state.steps : 0}
            aria-label="Re-run progress"
          />
          <span className="shrink-0 text-xs tabular-nums text-ink-muted" role="status">
            {state.phase === 'downloading'
              ? 'downloading the original…'
              : `step ${state.step} of ${state.steps}`}
          </span>
          <Button size="sm" icon={X} onClick={cancel}>
            Stop
          </Button>
        </div>
      )}
      {state.phase === 'error' && (
        <p className="text-xs text-state-bad" role="alert">
          {state.message}
        </p>
      )}
      {state.phase === 'done' && (
        <RerunVerdict replay={replay} result={state} recordedLayout={recordedLayout} />
      )}
    </div>
  );
}

function RerunVerdict({
  replay,
  result,
  recordedLayout,
}: {
  replay: TReplay;
  result: { digest: string; engine: string; digestLayout: number; runtime: string };
  recordedLayout: number;
}) {
  const matches = result.digest === replay.digest;
  const here = `engine ${result.engine}, digest layout ${result.digestLayout}`;
  if (matches)
    return (
      <p className="flex items-start gap-1 text-xs text-state-ok" role="status" data-verdict="match">
        <CircleCheck aria-hidden className="mt-0.5 size-3.5 shrink-0" />
        <span>
          Digest matches the server's: {result.digest.slice(0, 16)}… ({here}, in this browser).
        </span>
      </p>
    );
  if (recordedLayout !== DIGEST_LAYOUT)
    return (
      <p className="text-xs text-ink-muted" role="status" data-verdict="older-layout">
        Not comparable: the server's digest was recorded by an older engine (digest layout {recordedLayout});
        this browser computes layout {result.digestLayout}. Re-run the replay on the server to get a
        comparable digest.
      </p>
    );
  return (
    <p className="flex items-start gap-1 text-xs text-state-bad" role="alert" data-verdict="mismatch">
      <CircleAlert aria-hidden className="mt-0.5 size-3.5 shrink-0" />
      <span>
        Digest differs: this browser got {result.digest.slice(0, 16)}…, the server recorded{' '}
        {replay.digest?.slice(0, 16)}… ({here}). The bundle, the settings or the recorded digest do not agree.
      </span>
    </p>
  );
}
