import { describe, expect, it } from 'vitest';
import { createImportProgressBoard } from '../../../api/src/services/recordings/import-progress';

const OWNER = { caseId: 'case-1', userId: 'user-1' };

describe('the recording upload progress board', () => {
  it('shows an upload only to its uploader on its case, with the share clamped to 0..1', () => {
    const board = createImportProgressBoard();
    board.start('u1', OWNER);
    board.update('u1', 'reading', 1.7);
    expect(board.read('u1', 'case-1', 'user-1')).toEqual({ phase: 'reading', fraction: 1 });
    board.update('u1', 'writing', -0.2);
    expect(board.read('u1', 'case-1', 'user-1')).toEqual({ phase: 'writing', fraction: 0 });
    expect(board.read('u1', 'case-1', 'user-2')).toBeUndefined();
    expect(board.read('u1', 'case-2', 'user-1')).toBeUndefined();
    expect(board.read('nobody', 'case-1', 'user-1')).toBeUndefined();
  });

  it('forgets an ended upload five minutes after it ended, and never grows past its bound', () => {
    let now = 0;
    const board = createImportProgressBoard(() => now);
    board.start('ended', OWNER);
    board.update('ended', 'done', 1);
    now = 4 * 60_000;
    board.start('later', OWNER);
    expect(board.read('ended', 'case-1', 'user-1')).toEqual({ phase: 'done', fraction: 1 });
    now = 5 * 60_000 + 1;
    board.start('latest', OWNER);
    expect(board.read('ended', 'case-1', 'user-1')).toBeUndefined();
    expect(board.read('later', 'case-1', 'user-1')).toEqual({ phase: 'storing', fraction: 0 });
    for (let i = 0; i < 600; i++) board.start(`flood-${i}`, OWNER);
    expect(board.read('flood-0', 'case-1', 'user-1')).toBeUndefined();
    expect(board.read('flood-599', 'case-1', 'user-1')).toEqual({ phase: 'storing', fraction: 0 });
  });
});
