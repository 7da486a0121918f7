import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';
import { ApiError } from './api-client';

/**
 * Put the server's field messages on the form's fields. Returns the message for the form as a
 * whole (for errors that name no field on this form).
 */
export function applyServerErrors<T extends FieldValues>(error: unknown, setError: UseFormSetError<T>, known: readonly string[]): string | null {
  if (!(error instanceof ApiError)) return error instanceof Error ? error.message : 'Something went wrong.';
  let unplaced = false;
  for (const [field, message] of Object.entries(error.fields)) {
    if (known.includes(field)) setError(field as Path<T>, { type: 'server', message });
    else unplaced = true;
  }
  return unplaced || Object.keys(error.fields).length === 0 ? error.message : null;
}
