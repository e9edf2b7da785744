import { describe, expect, it } from 'vitest';
import { adjacentMoment, stepAfterKey } from '../../../../web/src/features/workspace/lib/step-navigation';

// Keyboard behaviour of a slider: WAI-ARIA Authoring Practices 1.2, "Slider Pattern" (arrows one
// step, Page Up/Down a larger step, Home/End the ends).
const times = Array.from({ length: 101 }, (_, k) => k * 0.1);

describe('scrubber keys', () => {
  it('moves one step on the arrows and clamps at the ends', () => {
    expect(stepAfterKey('ArrowRight', false, 5, times)).toBe(6);
    expect(stepAfterKey('ArrowLeft', false, 5, times)).toBe(4);
    expect(stepAfterKey('ArrowLeft', false, 0, times)).toBe(0);
    expect(stepAfterKey('ArrowRight', false, 100, times)).toBe(100);
  });

  it('moves one second of recording with Shift', () => {
    expect(stepAfterKey('ArrowRight', true, 20, times)).toBe(30);
    expect(stepAfterKey('ArrowLeft', true, 20, times)).toBe(10);
  });

  it('goes to the first and last step on Home and End and ignores other keys', () => {
    expect(stepAfterKey('Home', false, 42, times)).toBe(0);
    expect(stepAfterKey('End', false, 42, times)).toBe(100);
    expect(stepAfterKey('a', false, 42, times)).toBeNull();
  });
});

describe('previous and next moment of interest', () => {
  const moments = [12.5, 3, 40, 12.5];
  it('finds the nearest moment strictly after or before', () => {
    expect(adjacentMoment(moments, 0, 1)).toBe(3);
    expect(adjacentMoment(moments, 3, 1)).toBe(12.5);
    expect(adjacentMoment(moments, 12.5, -1)).toBe(3);
    expect(adjacentMoment(moments, 41, 1)).toBeNull();
  });
});
