import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';
import { ApiRequestError } from './api-client';

/** Puts the server's field issues next to their fields; returns the message for anything else. */
export function applyServerIssues<T extends FieldValues>(
  err: unknown,
  setError: UseFormSetError<T>,
  fields: readonly string[],
): string | null {
  if (!(err instanceof ApiRequestError)) return 'The server could not be reached; check your connection and try again.';
  let placed = false;
  for (const issue of err.issues) {
    if (fields.includes(issue.path)) {
      setError(issue.path as Path<T>, { type: 'server', message: issue.message });
      placed = true;
    }
  }
  return placed && err.code === 'invalid_input' ? null : err.message;
}
