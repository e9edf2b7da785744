import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';
import { isApiError } from './api-client';

/**
 * Puts the server's 400 field issues beside the matching form fields and returns a message for
 * whatever cannot be placed on a field (or `undefined` when every issue found its field).
 */
export function applyServerErrors<T extends FieldValues>(
  error: unknown,
  fieldNames: readonly Path<T>[],
  setError: UseFormSetError<T>,
): string | undefined {
  if (!isApiError(error)) return 'Something went wrong. Try again.';
  const issues = error.fieldIssues;
  const unplaced: string[] = [];
  for (const issue of issues) {
    const field = fieldNames.find((name) => name === issue.path);
    if (field) setError(field, { type: 'server', message: issue.message });
    else unplaced.push(issue.path ? `${issue.path}: ${issue.message}` : issue.message);
  }
  if (issues.length === 0) return error.message;
  return unplaced.length > 0 ? unplaced.join('; ') : undefined;
}
