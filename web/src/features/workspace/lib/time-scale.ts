/** A closed time interval, s since the bundle's start_time. */
export interface TimeDomain {
  start: number;
  end: number;
}

/**
 * Linear map from time (s) to horizontal pixels `[left, right]` and back. A zero-length domain is
 * widened by half a second each side so a one-step replay still draws.
 */
export function createTimeScale(domain: TimeDomain, left: number, right: number) {
  const start = domain.start;
  const end = domain.end > domain.start ? domain.end : domain.start + 1;
  const from = domain.end > domain.start ? start : start - 0.5;
  const to = domain.end > domain.start ? end : start + 0.5;
  const pxPerSecond = (right - left) / (to - from);
  return {
    toPx: (t: number) => left + (t - from) * pxPerSecond,
    toTime: (px: number) => from + (px - left) / pxPerSecond,
    domain: { start: from, end: to } as TimeDomain,
    pxPerSecond,
  };
}

/**
 * Index of the step whose time is nearest `t` in the ascending array `times` (binary search);
 * ties go to the earlier step. -1 for an empty array.
 */
export function nearestStep(times: ArrayLike<number>, t: number): number {
  const n = times.length;
  if (n === 0) return -1;
  let low = 0;
  let high = n - 1;
  while (low < high) {
    const mid = (low + high) >> 1;
    if (times[mid] < t) low = mid + 1;
    else high = mid;
  }
  if (low > 0 && t - times[low - 1] <= times[low] - t) return low - 1;
  return low;
}

/** Steps `[from, to)` whose times lie inside the domain, for drawing only what is in view. */
export function stepsInDomain(times: ArrayLike<number>, domain: TimeDomain): { from: number; to: number } {
  if (times.length === 0) return { from: 0, to: 0 };
  const from = Math.max(0, nearestStep(times, domain.start) - 1);
  const to = Math.min(times.length, nearestStep(times, domain.end) + 2);
  return { from, to };
}

/** Clamps a zoom request to the replay's span and a minimum width (s), keeping it ordered. */
export function clampDomain(requested: TimeDomain, full: TimeDomain, minimumSeconds = 0.5): TimeDomain {
  let start = Math.max(full.start, Math.min(requested.start, requested.end));
  let end = Math.min(full.end, Math.max(requested.start, requested.end));
  if (end - start < minimumSeconds) {
    const middle = (start + end) / 2;
    start = Math.max(full.start, middle - minimumSeconds / 2);
    end = Math.min(full.end, start + minimumSeconds);
  }
  return { start, end };
}
