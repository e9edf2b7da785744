/** Moving between the sightings of a gathered flag (one unmapped object seen on many passes). */

export interface Sighting {
  /** s since the bundle's start_time */
  start: number;
  end: number;
}

/** Index of the sighting the time falls in, or of the last one started before it; -1 before the first. */
export function sightingIndexAt(sightings: readonly Sighting[], time: number): number {
  let index = -1;
  for (let i = 0; i < sightings.length; i++) if (sightings[i].start <= time) index = i;
  return index;
}

/**
 * The sighting to jump to from `time`: the next one starting after it (direction 1) or the one
 * before the current (direction -1); null at either end.
 */
export function adjacentSighting(
  sightings: readonly Sighting[],
  time: number,
  direction: 1 | -1,
): Sighting | null {
  const current = sightingIndexAt(sightings, time);
  if (direction === 1) {
    const next = sightings.findIndex((s) => s.start > time);
    return next >= 0 ? sightings[next] : null;
  }
  // Inside a sighting "previous" means the one before it; before the first there is none.
  const isAtStart = current >= 0 && sightings[current].start === time;
  const previous = isAtStart || (current >= 0 && time <= sightings[current].end) ? current - 1 : current;
  return previous >= 0 ? sightings[previous] : null;
}
