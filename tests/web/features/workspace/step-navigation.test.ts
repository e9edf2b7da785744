import { describe, expect, it } from 'vitest';
import { adjacentMomentStep, stepAfterKey } from '../../../../web/src/features/workspace/lib/step-navigation';

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
  const moments = [12.5, 3, 4, 12.5];
  it('moves to the nearest moment step strictly after or before the cursor', () => {
    // 3 s is step 30, 4 s step 40, 12.5 s step 125 only if the replay were longer: here it clamps to 100.
    expect(adjacentMomentStep(moments, times, 0, 1)).toBe(30);
    expect(adjacentMomentStep(moments, times, 30, 1)).toBe(40);
    expect(adjacentMomentStep(moments, times, 40, -1)).toBe(30);
    expect(adjacentMomentStep(moments, times, 100, 1)).toBeNull();
  });

  it('never gets stuck on a moment between two steps (an event at 5.567 s with 0.1 s steps)', () => {
    const between = [2.1, 5.567];
    // 5.567 s is nearest the step at 5.6 s, step 56.
    const next = adjacentMomentStep(between, times, 50, 1);
    expect(next).toBe(56);
    // From there, Previous goes on to 2.1 s (step 21), not back onto step 56.
    expect(adjacentMomentStep(between, times, 56, -1)).toBe(21);
    // And Next is not offered past the last moment, but Previous always is.
    expect(adjacentMomentStep(between, times, 56, 1)).toBeNull();
    expect(adjacentMomentStep(between, times, 57, -1)).toBe(56);
  });
});
