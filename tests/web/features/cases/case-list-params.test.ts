import { ZCaseListQuery } from '@shared/contracts/cases';
import { parseCaseListParams, serializeCaseListParams } from '@web/features/cases/hooks/case-list-params';
import { describe, expect, it } from 'vitest';

describe('case list URL state', () => {
  it('an empty query string gives the API contract defaults', () => {
    expect(parseCaseListParams(new URLSearchParams())).toEqual(ZCaseListQuery.parse({}));
  });

  it('keeps valid values and drops only the invalid ones', () => {
    const params = parseCaseListParams(new URLSearchParams('status=bogus&severity=high&page=3&pageSize=999'));
    expect(params.status).toBeUndefined();
    expect(params.severity).toBe('high');
    expect(params.page).toBe(3);
    expect(params.pageSize).toBe(ZCaseListQuery.parse({}).pageSize);
  });

  it('round-trips through the URL and writes nothing for defaults', () => {
    const params = {
      ...ZCaseListQuery.parse({}),
      sort: 'title' as const,
      order: 'asc' as const,
      q: 'dock 4',
    };
    const search = serializeCaseListParams(params);
    expect(search.has('page')).toBe(false);
    expect(search.get('q')).toBe('dock 4');
    expect(parseCaseListParams(search)).toEqual(params);
  });
});
