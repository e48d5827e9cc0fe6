import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';
import { ApiError } from './api-fetch';

/**
 * Put the server's validation issues on the fields they name; returns what is left to show
 * above the form (the server's message, or a network message).
 */
export function applyServerError<T extends FieldValues>(
  error: unknown,
  setError: UseFormSetError<T>,
  fields: readonly Path<T>[],
): string | null {
  if (error instanceof ApiError) {
    let placed = 0;
    for (const issue of error.issues ?? []) {
      const name = issue.path.join('.') as Path<T>;
      if (fields.includes(name)) {
        setError(name, { type: 'server', message: issue.message });
        placed += 1;
      }
    }
    return placed > 0 && placed === (error.issues?.length ?? 0) ? null : error.message;
  }
  if (error instanceof TypeError)
    return 'The server cannot be reached. Check the connection and try again.';
  return error instanceof Error ? error.message : 'Something went wrong.';
}
