/**
 * People on the floor: bodies the scanner sees but the map never has. A standing person stays put;
 * a walking person paces back and forth between two points. They are stamped into the true grid
 * only while the sensors look (scans, detections), not for the safety fields: the invented people
 * keep clear of the robot's path, so they should not stop or slow it.
 */
import { fillBox, type SimGrid } from './sim-grid';

export interface PersonSpec {
  /** Where the person stands, or the two ends of the walk (m, map frame). */
  from: readonly [number, number];
  to?: readonly [number, number];
  /** Walking speed, m/s (ignored when standing). */
  speed?: number;
  /** Body width, m (a square footprint; about 0.45 m for an adult, common practice). */
  size: number;
}

/** Where a person is at time t (s): walkers go from `from` to `to` and back at constant speed. */
export function personPosition(person: PersonSpec, t: number): [number, number] {
  const [x0, y0] = person.from;
  if (!person.to || !person.speed) return [x0, y0];
  const [x1, y1] = person.to;
  const length = Math.hypot(x1 - x0, y1 - y0);
  if (length === 0) return [x0, y0];
  const travelled = (person.speed * t) % (2 * length);
  const share = (travelled <= length ? travelled : 2 * length - travelled) / length;
  return [x0 + share * (x1 - x0), y0 + share * (y1 - y0)];
}

/**
 * Marks every person's footprint at time t in `grid` and returns the cells it changed, so
 * `clearPeople` can restore exactly what was there (people never erase a structure).
 */
export function stampPeople(grid: SimGrid, people: readonly PersonSpec[], t: number): Uint8Array {
  const before = grid.occupied.slice();
  for (const person of people) {
    const [x, y] = personPosition(person, t);
    const half = person.size / 2;
    fillBox(grid, x - half, y - half, x + half, y + half);
  }
  return before;
}

/** Restores the grid as it was before `stampPeople`. */
export function clearPeople(grid: SimGrid, before: Uint8Array): void {
  grid.occupied.set(before);
}
