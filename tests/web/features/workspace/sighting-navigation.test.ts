import { describe, expect, it } from 'vitest';
import {
  adjacentSighting,
  sightingIndexAt,
} from '../../../../web/src/features/workspace/lib/sighting-navigation';

// Three passes by the same object, worked by hand.
const SIGHTINGS = [
  { start: 16, end: 18 },
  { start: 110, end: 112 },
  { start: 263, end: 265 },
];

describe('sightingIndexAt', () => {
  it('names the sighting the time falls in or follows', () => {
    expect(sightingIndexAt(SIGHTINGS, 5)).toBe(-1);
    expect(sightingIndexAt(SIGHTINGS, 16)).toBe(0);
    expect(sightingIndexAt(SIGHTINGS, 50)).toBe(0);
    expect(sightingIndexAt(SIGHTINGS, 111)).toBe(1);
    expect(sightingIndexAt(SIGHTINGS, 900)).toBe(2);
  });
});

describe('adjacentSighting', () => {
  it('jumps forward to the next sighting and stops after the last', () => {
    expect(adjacentSighting(SIGHTINGS, 0, 1)).toEqual(SIGHTINGS[0]);
    expect(adjacentSighting(SIGHTINGS, 16, 1)).toEqual(SIGHTINGS[1]);
    expect(adjacentSighting(SIGHTINGS, 263, 1)).toBeNull();
  });

  it('jumps back to the sighting before the current one, and between passes to the last one seen', () => {
    expect(adjacentSighting(SIGHTINGS, 110, -1)).toEqual(SIGHTINGS[0]);
    expect(adjacentSighting(SIGHTINGS, 111, -1)).toEqual(SIGHTINGS[0]);
    expect(adjacentSighting(SIGHTINGS, 200, -1)).toEqual(SIGHTINGS[1]);
    expect(adjacentSighting(SIGHTINGS, 16, -1)).toBeNull();
    expect(adjacentSighting(SIGHTINGS, 3, -1)).toBeNull();
  });
});
