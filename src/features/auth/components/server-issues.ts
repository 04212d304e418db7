import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';
import { ApiError } from '@/lib/api-client';

/**
 * Puts the server's field issues (the same zod schema ran there) beside the fields they name, and answers whether
 * any found a home; when none did, the form shows the sentence in its banner instead.
 */
export function placeServerIssues<T extends FieldValues>(error: unknown, setError: UseFormSetError<T>, fields: readonly Path<T>[]): boolean {
  if (!(error instanceof ApiError)) return false;
  let placed = false;
  for (const issue of error.issues) {
    const field = fields.find((f) => f === issue.path);
    if (field) {
      setError(field, { type: 'server', message: issue.message }, { shouldFocus: !placed });
      placed = true;
    }
  }
  return placed;
}
