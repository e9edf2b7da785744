import { StepLane, type StepLaneState } from '@web/features/workspace/lib/step-lane';
import { describe, expect, it } from 'vitest';

// The rules checked here are the issue's own (latest-wins: superseded requests aborted, at most
// one in flight plus the newest, a late answer never paints over a newer one), not values the
// lane computes.

interface Pending {
  step: number;
  signal: AbortSignal;
  resolve: (v: string) => void;
  reject: (e: Error) => void;
}

function makeLane(lastStep = 100, options: { minGapMs?: number } = {}) {
  const clock = { now: 0 };
  const pending: Pending[] = [];
  const asked: number[] = [];
  const cache = new Map<number, string>();
  const timers: { fire: () => void; due: number }[] = [];
  let state: StepLaneState<string> | null = null;
  const lane = new StepLane<string>({
    lastStep,
    fetchStep: (step, signal) =>
      new Promise((resolve, reject) => {
        asked.push(step);
        pending.push({ step, signal, resolve, reject });
      }),
    readCache: (step) => cache.get(step),
    writeCache: (step, v) => cache.set(step, v),
    onChange: (s) => {
      state = s;
    },
    prefetchAhead: 2,
    prefetchBehind: 1,
    // Pacing has a test of its own below; here every request may follow the last at once.
    minGapMs: options.minGapMs ?? 0,
    now: () => clock.now,
    setTimer: (callback, ms) => timers.push({ fire: callback, due: clock.now + ms }),
    clearTimer: () => timers.splice(0),
  });
  const answer = async (step: number) => {
    const p = pending.find((x) => x.step === step && !x.signal.aborted);
    if (!p) throw new Error(`no live request for step ${step}`);
    pending.splice(pending.indexOf(p), 1);
    p.resolve(`data ${step}`);
    await Promise.resolve();
    await Promise.resolve();
  };
  const fail = async (step: number) => {
    const p = pending.find((x) => x.step === step && !x.signal.aborted);
    if (!p) throw new Error(`no live request for step ${step}`);
    pending.splice(pending.indexOf(p), 1);
    p.reject(new Error('step not available'));
    await Promise.resolve();
    await Promise.resolve();
  };
  const live = () => pending.filter((p) => !p.signal.aborted).map((p) => p.step);
  return {
    lane,
    asked,
    live,
    answer,
    fail,
    cache,
    fireTimers: () => {
      for (const { fire } of timers.splice(0)) fire();
    },
    /** Fires only the timers whose time has come on the test clock. */
    fireDueTimers: () => {
      const due = timers.filter((timer) => timer.due <= clock.now);
      for (const timer of due) timers.splice(timers.indexOf(timer), 1);
      for (const { fire } of due) fire();
    },
    state: () => state,
    clock,
  };
}

describe('StepLane (latest-wins step requests)', () => {
  it('asks once for a resting cursor and draws that step', async () => {
    const t = makeLane();
    t.lane.seek(10);
    expect(t.live()).toEqual([10]);
    await t.answer(10);
    expect(t.state()?.drawnStep).toBe(10);
    expect(t.state()?.drawn).toBe('data 10');
  });

  it('during a drag keeps at most the one in progress plus the newest, dropping every step between', async () => {
    const t = makeLane();
    t.lane.seek(1);
    for (let k = 2; k <= 200; k++) t.lane.seek(k % 100);
    // Only step 1 was ever asked for while the pointer kept moving.
    expect(t.asked).toEqual([1]);
    t.fireTimers(); // the cursor rests on step 0 (200 % 100)
    expect(t.live()).toEqual([1, 0]);
    expect(t.live().length).toBeLessThanOrEqual(2);
  });

  it('draws an intermediate step labelled as such, then the cursor step; a late answer never paints over it', async () => {
    const t = makeLane();
    t.lane.seek(5);
    t.lane.seek(50);
    t.fireTimers();
    expect(t.live()).toEqual([5, 50]);
    await t.answer(50);
    expect(t.state()?.drawnStep).toBe(50);
    // The older request was aborted once the cursor step arrived; nothing it says is drawn.
    expect(t.live()).not.toContain(5);
    expect(t.state()?.target).toBe(50);
  });

  it('when the request in progress ends first, draws it as an intermediate and asks for the newest', async () => {
    const t = makeLane();
    t.lane.seek(5);
    t.lane.seek(60);
    await t.answer(5);
    expect(t.state()?.drawnStep).toBe(5);
    expect(t.state()?.target).toBe(60);
    expect(t.live()).toEqual([60]);
    await t.answer(60);
    expect(t.state()?.drawnStep).toBe(60);
  });

  it('asks for the cursor step no faster than the least gap, however fast the server answers', async () => {
    // 60 pointer moves over 1 s, each answered at once: without pacing the lane would ask 60 times.
    const t = makeLane(6000, { minGapMs: 50 });
    for (let frame = 0; frame < 60; frame++) {
      t.clock.now = frame * (1000 / 60);
      // The server answers each request one frame after it was made, when the cursor has moved on.
      const earlier = t.live();
      t.lane.seek(frame * 100);
      t.fireDueTimers();
      for (const step of earlier) if (t.live().includes(step)) await t.answer(step);
    }
    // At most one request per 50 ms over the second, plus the first.
    expect(t.asked.length).toBeLessThanOrEqual(21);
    expect(t.asked.length).toBeGreaterThan(1);
  });

  it('a cached step is drawn at once and aborts what is in flight', () => {
    const t = makeLane();
    t.cache.set(30, 'cached 30');
    t.lane.seek(7);
    t.lane.seek(30);
    expect(t.state()?.drawnStep).toBe(30);
    expect(t.live()).not.toContain(7);
  });

  it('prefetches the neighbours one at a time after the cursor rests, and a seek aborts a prefetch', async () => {
    const t = makeLane();
    t.lane.seek(10);
    await t.answer(10);
    expect(t.live()).toEqual([11]);
    await t.answer(11);
    expect(t.live()).toEqual([12]);
    t.lane.seek(40);
    expect(t.live()).toEqual([40]);
  });

  it('reports the error of the cursor step, and forgets it on the next seek', async () => {
    const t = makeLane();
    t.lane.seek(3);
    await t.fail(3);
    expect(t.state()?.error?.message).toBe('step not available');
    expect(t.live()).toEqual([]); // not asked again in a loop
    t.lane.seek(4);
    expect(t.state()?.error).toBeNull();
  });

  it('dispose aborts everything in flight', () => {
    const t = makeLane();
    t.lane.seek(3);
    t.lane.dispose();
    expect(t.live()).toEqual([]);
  });
});
