import { describe, expect, it } from 'vitest';
import { type CasePathFacts, deriveCasePath } from '../../shared/case-path';

// The stages and their order are the product's own (evidence in → replayed → findings drafted →
// signed → fix verified → closed); each case below is worked out by hand from that rule.
const base: CasePathFacts = {
  status: 'open',
  openedAt: '2026-11-10T08:00:00.000Z',
  statusChangedAt: null,
  firstValidBundleAt: null,
  firstFinishedReplayAt: null,
  findingsStartedAt: null,
  lastSignedAt: null,
  fixesLinked: 0,
  fixesUnverified: 0,
  lastFixVerifiedAt: null,
};

const states = (facts: CasePathFacts) => deriveCasePath(facts).stages.map((s) => `${s.stage}:${s.state}`);

describe('case path', () => {
  it('a new case waits for evidence, held by the investigator since it was opened', () => {
    const path = deriveCasePath(base);
    expect(states(base)).toEqual([
      'evidence_in:now',
      'replayed:todo',
      'findings_drafted:todo',
      'signed:todo',
      'fix_verified:todo',
      'closed:todo',
    ]);
    expect(path.standing).toBeNull();
    expect(path.summary).toBe('Waiting for evidence');
    expect(path.holders).toEqual(['investigator']);
    expect(path.since).toBe('2026-11-10T08:00:00.000Z');
  });

  it('submitted findings wait for a reviewer, since the submission', () => {
    const facts: CasePathFacts = {
      ...base,
      status: 'in_review',
      statusChangedAt: '2026-11-12T15:30:00.000Z',
      firstValidBundleAt: '2026-11-10T09:00:00.000Z',
      firstFinishedReplayAt: '2026-11-10T09:05:00.000Z',
      findingsStartedAt: '2026-11-11T10:00:00.000Z',
    };
    const path = deriveCasePath(facts);
    expect(states(facts).slice(0, 4)).toEqual([
      'evidence_in:done',
      'replayed:done',
      'findings_drafted:done',
      'signed:now',
    ]);
    expect(path.standing).toBe('findings_drafted');
    expect(path.summary).toBe('Findings awaiting sign-off');
    expect(path.holders).toEqual(['reviewer']);
    expect(path.since).toBe('2026-11-12T15:30:00.000Z');
  });

  it('a reopened case is no longer signed even though a sign-off is on record', () => {
    const facts: CasePathFacts = {
      ...base,
      status: 'analysing',
      statusChangedAt: '2026-11-14T08:00:00.000Z',
      firstValidBundleAt: '2026-11-10T09:00:00.000Z',
      firstFinishedReplayAt: '2026-11-10T09:05:00.000Z',
      findingsStartedAt: '2026-11-11T10:00:00.000Z',
      lastSignedAt: '2026-11-13T08:00:00.000Z',
    };
    expect(states(facts)[3]).toBe('signed:now');
    expect(deriveCasePath(facts).summary).toBe('Findings being drafted');
  });

  it('a signed case with an unverified fix waits for its verification', () => {
    const facts: CasePathFacts = {
      ...base,
      status: 'signed_off',
      statusChangedAt: '2026-11-13T08:00:00.000Z',
      firstValidBundleAt: '2026-11-10T09:00:00.000Z',
      firstFinishedReplayAt: '2026-11-10T09:05:00.000Z',
      findingsStartedAt: '2026-11-11T10:00:00.000Z',
      lastSignedAt: '2026-11-13T08:00:00.000Z',
      fixesLinked: 2,
      fixesUnverified: 1,
      lastFixVerifiedAt: '2026-11-15T08:00:00.000Z',
    };
    expect(states(facts).slice(3)).toEqual(['signed:done', 'fix_verified:now', 'closed:todo']);
    expect(deriveCasePath(facts).summary).toBe('Signed; fix awaiting verification');
    // Verifying a fix is the investigator's or the reviewer's move (access of POST .../fixes/:fixId/verify).
    expect(deriveCasePath(facts).holders).toEqual(['investigator', 'reviewer']);
  });

  it('a signed case whose fixes are all verified waits for the reviewer to close it', () => {
    // Closing a signed case is the reviewer's (or an admin's) move in the lifecycle table.
    const facts: CasePathFacts = {
      ...base,
      status: 'signed_off',
      statusChangedAt: '2026-11-13T08:00:00.000Z',
      firstValidBundleAt: '2026-11-10T09:00:00.000Z',
      firstFinishedReplayAt: '2026-11-10T09:05:00.000Z',
      findingsStartedAt: '2026-11-11T10:00:00.000Z',
      lastSignedAt: '2026-11-13T08:00:00.000Z',
      fixesLinked: 1,
      fixesUnverified: 0,
      lastFixVerifiedAt: '2026-11-15T08:00:00.000Z',
    };
    expect(deriveCasePath(facts).summary).toBe('Fix verified; ready to close');
    expect(deriveCasePath(facts).holders).toEqual(['reviewer']);
  });

  it('a case closed without a linked fix skips that stage and is held by nobody', () => {
    const facts: CasePathFacts = {
      ...base,
      status: 'closed',
      statusChangedAt: '2026-11-20T08:00:00.000Z',
      firstValidBundleAt: '2026-11-10T09:00:00.000Z',
      firstFinishedReplayAt: '2026-11-10T09:05:00.000Z',
      findingsStartedAt: '2026-11-11T10:00:00.000Z',
      lastSignedAt: '2026-11-13T08:00:00.000Z',
    };
    const path = deriveCasePath(facts);
    expect(states(facts).slice(3)).toEqual(['signed:done', 'fix_verified:skipped', 'closed:done']);
    expect(path.standing).toBe('closed');
    expect(path.holders).toEqual([]);
    expect(path.since).toBe('2026-11-20T08:00:00.000Z');
  });
});
