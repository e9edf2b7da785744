import { describeAuditEntry, foldRepeatedSaves } from '@web/features/lifecycle/lib/describe-audit-entry';
import { describe, expect, it } from 'vitest';

describe('case history lines', () => {
  it('says each case-work step in plain English, with the version and status labels', () => {
    expect(describeAuditEntry({ action: 'findings.submit', details: { version: 2 } })).toBe(
      'Findings version 2 submitted for review',
    );
    expect(
      describeAuditEntry({
        action: 'case.transition',
        details: { from: 'in_review', to: 'changes_requested' },
      }),
    ).toBe('Status changed from In review to Changes requested');
    // Actions without a detailed line take their shared label; one unknown to this build reads as words.
    expect(describeAuditEntry({ action: 'saved_query.create', details: {} })).toBe('Query saved');
    expect(describeAuditEntry({ action: 'bookmark.create', details: {} })).toBe('Moment pinned');
    expect(describeAuditEntry({ action: 'something.new', details: {} })).toBe('Something new');
  });

  it('folds runs of draft saves into one line with a count, keeping other steps in order', () => {
    const entries = ['findings.save', 'findings.save', 'findings.submit', 'findings.save'].map(
      (action, id) => ({
        id,
        action,
        details: {},
      }),
    );
    const folded = foldRepeatedSaves(entries);
    expect(folded.map((f) => [f.entry.action, f.repeats])).toEqual([
      ['findings.save', 2],
      ['findings.submit', 1],
      ['findings.save', 1],
    ]);
    expect(folded[0]?.entry.id).toBe(1); // the latest save of the run, for its time
  });
});
