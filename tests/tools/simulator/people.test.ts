import { describe, expect, it } from 'vitest';
import { clearPeople, personPosition, stampPeople } from '../../../tools/simulator/people';
import { createGrid, isOccupiedAt } from '../../../tools/simulator/sim-grid';

describe('personPosition', () => {
  it('keeps a standing person in place', () => {
    expect(personPosition({ from: [3, 4], size: 0.45 }, 123.4)).toEqual([3, 4]);
  });

  it('walks out and back at constant speed (10 m at 1 m/s: out by 10 s, back by 20 s)', () => {
    // Hand-worked positions of a 10 m walk along x at 1 m/s.
    const walker = { from: [0, 2] as const, to: [10, 2] as const, speed: 1, size: 0.45 };
    expect(personPosition(walker, 0)).toEqual([0, 2]);
    expect(personPosition(walker, 4)[0]).toBeCloseTo(4, 9);
    expect(personPosition(walker, 10)[0]).toBeCloseTo(10, 9);
    expect(personPosition(walker, 13)[0]).toBeCloseTo(7, 9);
    expect(personPosition(walker, 21)[0]).toBeCloseTo(1, 9);
  });
});

describe('stampPeople / clearPeople', () => {
  it('puts the body on the grid for the sensors and restores the grid exactly afterwards', () => {
    const grid = createGrid(5, 5, 0.05);
    grid.occupied[0] = 1; // a structure that must survive
    const before = grid.occupied.slice();
    const saved = stampPeople(grid, [{ from: [2.5, 2.5], size: 0.45 }], 0);
    expect(isOccupiedAt(grid, 2.5, 2.5)).toBe(true);
    expect(isOccupiedAt(grid, 2.7, 2.5)).toBe(true); // within the 0.225 m half-width
    expect(isOccupiedAt(grid, 2.8, 2.5)).toBe(false);
    clearPeople(grid, saved);
    expect(grid.occupied).toEqual(before);
  });
});
