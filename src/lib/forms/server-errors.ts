import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';
import { isApiError } from '@/lib/api/client';

const FALLBACK_MESSAGE = 'Something went wrong. Try again.';

/**
 * Puts the server's per-field errors on the matching inputs and returns the text for the form's Alert;
 * field errors for inputs the form does not have are added to that text so nothing is lost.
 */
export function applyServerErrors<T extends FieldValues>(
  error: unknown,
  setError: UseFormSetError<T>,
  fieldNames: readonly Path<T>[],
): string {
  if (!isApiError(error)) return FALLBACK_MESSAGE;
  const leftovers: string[] = [];
  for (const [field, message] of Object.entries(error.fields ?? {})) {
    const match = fieldNames.find((name) => name === field);
    if (match) setError(match, { type: 'server', message });
    else leftovers.push(message);
  }
  return [error.message, ...leftovers].join(' ');
}
