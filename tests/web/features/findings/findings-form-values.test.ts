import { ZFindingsContent, ZFindingsDraft } from '@shared/contracts/findings';
import {
  draftFromFormValues,
  formValuesFromDraft,
  ZFindingsForm,
} from '@web/features/findings/hooks/findings-form-values';
import { formatDiffPath, formatDiffValue } from '@web/features/findings/lib/format-diff-value';
import { describe, expect, it } from 'vitest';

const complete = {
  summary: 'Tug touched rack B2 at 0.2 m/s.',
  incidentClass: 'contact_no_injury' as const,
  rootCause: { category: 'map_out_of_date' as const, text: 'Row B moved overnight.' },
  contributingFactors: [{ category: 'human_factors' as const, text: 'Re-layout not announced.' }],
  evidence: [],
  correctiveActions: [{ description: 'Re-map hall B', owner: 'Site engineering', dueDate: '2026-12-01' }],
};

// The oracle for these helpers is the API's own contract (ZFindingsDraft / ZFindingsContent): what the
// form sends must be what the server accepts (common practice: one schema for client and server).
describe('findings form values', () => {
  it('an empty form saves as a draft the server accepts, with no blank fields', () => {
    const draft = draftFromFormValues(formValuesFromDraft(null));
    expect(ZFindingsDraft.safeParse(draft).success).toBe(true);
    expect(draft).not.toHaveProperty('summary');
    expect(draft).not.toHaveProperty('incidentClass');
    expect(draft).not.toHaveProperty('rootCause');
  });

  it('drops empty repeated rows but keeps half-filled ones, so the server can say what is missing', () => {
    const values = formValuesFromDraft(complete);
    values.contributingFactors.push({ category: '', text: '  ' });
    values.correctiveActions.push({ description: 'Check floor marks', owner: '', dueDate: '' });
    const draft = draftFromFormValues(values);
    expect(draft.contributingFactors).toHaveLength(1);
    expect(draft.correctiveActions).toHaveLength(2);
    expect(ZFindingsDraft.safeParse(draft).success).toBe(false);
  });

  it('round-trips complete findings unchanged and they pass the submission schema', () => {
    const draft = draftFromFormValues(formValuesFromDraft(complete));
    expect(ZFindingsContent.parse(draft)).toEqual(complete);
  });

  it('an unset picker gets a plain message, not the enum list', () => {
    const result = ZFindingsForm.safeParse({ ...complete, incidentClass: '' });
    expect(result.success).toBe(false);
    expect(result.error?.issues[0]?.message).toBe('Pick the incident class');
  });
});

describe('diff display', () => {
  it('names paths in words and numbers rows from 1', () => {
    expect(formatDiffPath('correctiveActions.0.owner')).toBe('Corrective action › #1 › owner');
    expect(formatDiffPath('summary')).toBe('Summary');
  });

  it('shows category labels, absent values and objects readably', () => {
    expect(formatDiffValue('map_out_of_date')).toBe('Map out of date');
    expect(formatDiffValue(null)).toBe('(empty)');
    expect(formatDiffValue({ a: 1 })).toContain('"a": 1');
  });
});
