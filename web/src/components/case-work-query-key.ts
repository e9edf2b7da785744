/**
 * Roots of the case query keys, written once. Case-work features hang their keys under
 * `caseWorkKey(caseId)`, so one invalidation after a write refreshes the lifecycle, findings,
 * fixes and history of that case together; `CASES_KEY` also covers the case detail and lists,
 * whose status a write may have changed.
 */
export const CASES_KEY = ['cases'] as const;

export const caseWorkKey = (caseId: string) => ['cases', 'work', caseId] as const;
