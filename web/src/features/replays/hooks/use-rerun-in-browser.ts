import type { TReplay } from '@shared/contracts/replays';
import { useCallback, useEffect, useRef, useState } from 'react';
import type { RerunMessage, RerunRequest } from '../lib/rerun-messages';

export type RerunState =
  | { phase: 'idle' }
  | { phase: 'downloading' }
  | { phase: 'running'; step: number; steps: number }
  | { phase: 'done'; digest: string; engine: string; digestLayout: number; runtime: string }
  | { phase: 'error'; message: string };

/**
 * Re-runs `replay` in a Web Worker from the bundle's original file (GET /api/bundles/:id/original)
 * with the settings the server used; `cancel` ends the worker.
 */
export function useRerunInBrowser(replay: TReplay) {
  const [state, setState] = useState<RerunState>({ phase: 'idle' });
  const worker = useRef<Worker | null>(null);

  const stop = useCallback(() => {
    worker.current?.terminate();
    worker.current = null;
  }, []);
  useEffect(() => stop, [stop]);

  const start = useCallback(async () => {
    stop();
    setState({ phase: 'downloading' });
    let zip: ArrayBuffer;
    try {
      const response = await fetch(`/api/bundles/${replay.bundleId}/original`, {
        credentials: 'same-origin',
      });
      if (!response.ok) throw new Error(`the server answered ${response.status} for the original bundle`);
      zip = await response.arrayBuffer();
    } catch (error) {
      setState({
        phase: 'error',
        message: `Could not download the original bundle: ${(error as Error).message}`,
      });
      return;
    }
    const started = new Worker(new URL('../workers/rerun-replay.worker.ts', import.meta.url), {
      type: 'module',
    });
    worker.current = started;
    started.onmessage = (event: MessageEvent<RerunMessage>) => {
      const message = event.data;
      if (message.type === 'progress')
        setState({ phase: 'running', step: message.step, steps: message.steps });
      else {
        setState(
          message.type === 'done'
            ? { phase: 'done', ...message }
            : { phase: 'error', message: message.message },
        );
        stop();
      }
    };
    started.onerror = (event) => {
      setState({ phase: 'error', message: `The re-run stopped: ${event.message || 'the worker failed'}` });
      stop();
    };
    const request: RerunRequest = { zip, settings: replay.settings, overrides: replay.overrides };
    started.postMessage(request, [zip]);
    setState({ phase: 'running', step: 0, steps: replay.steps ?? 0 });
  }, [replay, stop]);

  const cancel = useCallback(() => {
    stop();
    setState({ phase: 'idle' });
  }, [stop]);

  return { state, start, cancel };
}
