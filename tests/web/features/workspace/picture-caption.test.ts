import { describe, expect, it } from 'vitest';
import { pictureCaption, pictureFileName } from '../../../../web/src/features/workspace/lib/picture-caption';

// Invented replay; the expected captions are written out by hand from issue #12, point 8: every
// picture names its replay, a short digest and the step and time it shows.
const MOMENT = {
  replayId: '96b69dea-0c1d-4e2f-8a3b-bb0000000002',
  replayLabel: 'Wider motion noise',
  digest: 'c0ffee00'.repeat(8),
  step: 42,
  time: 4.2,
};

describe('picture captions', () => {
  it('names the replay, the first 12 digest digits, the step and the time in s', () => {
    expect(pictureCaption('map', MOMENT)).toBe(
      'Map · Wider motion noise · digest c0ffee00c0ff… · step 42 · 4.20 s',
    );
    expect(pictureCaption('timeline', MOMENT)).toBe(
      'Timeline · Wider motion noise · digest c0ffee00c0ff… · step 42 · 4.20 s',
    );
  });

  it('falls back to the replay id when unlabelled, and says when there is no digest yet', () => {
    expect(pictureCaption('map', { ...MOMENT, replayLabel: '  ', digest: null })).toBe(
      'Map · replay 96b69dea · no digest yet · step 42 · 4.20 s',
    );
  });

  it('gives files names that say what and when', () => {
    expect(pictureFileName('timeline', MOMENT, 'svg')).toBe('timeline-96b69dea-step-42.svg');
  });
});
