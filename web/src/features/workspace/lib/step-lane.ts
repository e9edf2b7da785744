/**
 * Latest-wins fetching of replay steps. Dragging the cursor asks for hundreds of steps a second;
 * the server can answer a few. The lane keeps at most one request "in progress" (its answer is
 * drawn as an intermediate frame, labelled as such) plus one for the newest step, and forgets
 * every step asked for in between. When the cursor rests it prefetches the neighbours one at a
 * time, and any new target aborts a prefetch. Answers for anything but the newest target are
 * still drawn only if nothing newer is on screen, so a late answer never paints over a newer one.
 */
export interface StepLaneOptions<T> {
  fetchStep: (step: number, signal: AbortSignal) => Promise<T>;
  /** Steps already fetched (the query cache), read before asking the server. */
  readCache: (step: number) => T | undefined;
  writeCache: (step: number, value: T) => void;
  /** Told whenever the drawn step, the target or the error changes. */
  onChange: (state: StepLaneState<T>) => void;
  lastStep: number;
  /** How long the cursor must rest before the newest step is fetched beside the one in progress. */
  settleMs?: number;
  prefetchAhead?: number;
  prefetchBehind?: number;
  /**
   * Least time (ms) between two requests for the cursor's step. Without it a fast server is asked
   * as often as it answers while the pointer moves, so the request count grows with its speed.
   */
  minGapMs?: number;
  now?: () => number;
  setTimer?: (callback: () => void, ms: number) => unknown;
  clearTimer?: (handle: unknown) => void;
}

export interface StepLaneState<T> {
  /** The step the cursor is on. */
  target: number;
  /** The step whose data is on screen, or null before the first answer. */
  drawnStep: number | null;
  drawn: T | undefined;
  /** The error of the newest target's request, if it failed. */
  error: Error | null;
}

interface Request {
  step: number;
  controller: AbortController;
  isPrefetch: boolean;
}

export const STEP_LANE_SETTLE_MS = 90;
export const STEP_LANE_PREFETCH_AHEAD = 6;
export const STEP_LANE_PREFETCH_BEHIND = 2;
export const STEP_LANE_MIN_GAP_MS = 50;

export class StepLane<T> {
  private readonly options: Required<StepLaneOptions<T>>;
  private readonly requests: Request[] = [];
  private target = -1;
  private drawnStep: number | null = null;
  private drawn: T | undefined;
  private error: Error | null = null;
  private settleTimer: unknown = null;
  private isDisposed = false;
  private lastStartAt = Number.NEGATIVE_INFINITY;

  constructor(options: StepLaneOptions<T>) {
    this.options = {
      settleMs: STEP_LANE_SETTLE_MS,
      prefetchAhead: STEP_LANE_PREFETCH_AHEAD,
      prefetchBehind: STEP_LANE_PREFETCH_BEHIND,
      minGapMs: STEP_LANE_MIN_GAP_MS,
      now: () => performance.now(),
      setTimer: (callback, ms) => setTimeout(callback, ms),
      clearTimer: (handle) => clearTimeout(handle as ReturnType<typeof setTimeout>),
      ...options,
    };
  }

  /** Steps being fetched right now (for tests and the "loading" label). */
  inFlight(): number[] {
    return this.requests.map((r) => r.step);
  }

  state(): StepLaneState<T> {
    return { target: this.target, drawnStep: this.drawnStep, drawn: this.drawn, error: this.error };
  }

  /** Moves the cursor to `step`. */
  seek(step: number) {
    if (this.isDisposed || step === this.target) return;
    this.target = step;
    this.error = null;
    this.clearSettle();
    for (const r of [...this.requests]) if (r.isPrefetch && r.step !== step) this.abort(r);
    const cached = this.options.readCache(step);
    if (cached !== undefined) {
      this.show(step, cached);
      this.abortAllBut(null);
      this.prefetchNext();
      return;
    }
    this.emit();
    if (this.requests.some((r) => r.step === step)) return;
    if (this.requests.length === 0) {
      this.startTargetPaced();
      return;
    }
    // A request is in progress: drop the superseded newest one and wait for the cursor to rest
    // (or for the one in progress to finish) before asking for this step.
    const [, ...newer] = this.requests;
    for (const r of newer) this.abort(r);
    this.startTargetAfter(this.options.settleMs);
  }

  dispose() {
    this.isDisposed = true;
    this.clearSettle();
    this.abortAllBut(null);
  }

  private isLoaded(step: number) {
    return this.drawnStep === step || this.options.readCache(step) !== undefined;
  }

  /** Asks for the cursor's step now, or once `minGapMs` has passed since the last such request. */
  private startTargetPaced() {
    this.clearSettle();
    const wait = this.lastStartAt + this.options.minGapMs - this.options.now();
    if (wait <= 0) {
      this.start(this.target, false);
      return;
    }
    this.startTargetAfter(wait);
  }

  /** Asks for the cursor's step after `ms`, unless it has arrived or been asked for by then. */
  private startTargetAfter(ms: number) {
    this.settleTimer = this.options.setTimer(() => {
      this.settleTimer = null;
      if (!this.isLoaded(this.target) && !this.requests.some((r) => r.step === this.target))
        this.start(this.target, false);
    }, ms);
  }

  private start(step: number, isPrefetch: boolean) {
    if (!isPrefetch) this.lastStartAt = this.options.now();
    const request: Request = { step, controller: new AbortController(), isPrefetch };
    this.requests.push(request);
    this.options.fetchStep(step, request.controller.signal).then(
      (value) => this.settle(request, value, null),
      (error: unknown) => this.settle(request, undefined, error),
    );
  }

  private settle(request: Request, value: T | undefined, error: unknown) {
    const index = this.requests.indexOf(request);
    if (index < 0 || this.isDisposed) return; // aborted or superseded: its answer paints nothing
    this.requests.splice(index, 1);
    if (value !== undefined) {
      this.options.writeCache(request.step, value);
      if (request.step === this.target) {
        this.show(request.step, value);
        this.abortAllBut(null);
      } else if (!request.isPrefetch && !this.requests.some((r) => r.step === this.target)) {
        // An intermediate answer while dragging: draw it (labelled as not the cursor's step).
        this.show(request.step, value);
      }
    } else if (request.step === this.target) {
      this.error = error instanceof Error ? error : new Error(String(error));
      this.emit();
      return; // no automatic retry: the error is shown and the next seek asks again
    }
    if (!this.isLoaded(this.target)) {
      if (this.requests.length === 0) this.startTargetPaced();
      return;
    }
    this.prefetchNext();
  }

  private prefetchNext() {
    if (this.requests.length > 0 || this.target < 0) return;
    const { prefetchAhead, prefetchBehind, lastStep, readCache } = this.options;
    const order: number[] = [];
    for (let k = 1; k <= prefetchAhead; k++) order.push(this.target + k);
    for (let k = 1; k <= prefetchBehind; k++) order.push(this.target - k);
    const next = order.find((k) => k >= 0 && k <= lastStep && readCache(k) === undefined);
    if (next !== undefined) this.start(next, true);
  }

  private show(step: number, value: T) {
    this.drawnStep = step;
    this.drawn = value;
    this.emit();
  }

  private abort(request: Request) {
    const index = this.requests.indexOf(request);
    if (index >= 0) this.requests.splice(index, 1);
    request.controller.abort();
  }

  private abortAllBut(step: number | null) {
    for (const r of [...this.requests]) if (r.step !== step) this.abort(r);
  }

  private clearSettle() {
    if (this.settleTimer !== null) this.options.clearTimer(this.settleTimer);
    this.settleTimer = null;
  }

  private emit() {
    this.options.onChange(this.state());
  }
}
