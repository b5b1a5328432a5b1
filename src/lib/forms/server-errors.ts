import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';
import { isApiError } from '@/lib/api/client';

const FALLBACK_MESSAGE = 'Something went wrong. Try again.';

/**
 * Puts the server's per-field errors on the matching inputs and returns the text for the form's Alert;
 * field errors for inputs the form does not have are added to that text so nothing is lost, and the
 * main message is left out when it is the same as one already shown on an input (empty text then).
 */
export function applyServerErrors<T extends FieldValues>(
  error: unknown,
  setError: UseFormSetError<T>,
  fieldNames: readonly Path<T>[],
): string {
  if (!isApiError(error)) return FALLBACK_MESSAGE;
  const leftovers: string[] = [];
  const onFields = new Set<string>();
  for (const [field, message] of Object.entries(error.fields ?? {})) {
    const match = fieldNames.find((name) => name === field);
    if (match) {
      setError(match, { type: 'server', message });
      onFields.add(message);
    } else leftovers.push(message);
  }
  // A message already shown beside its input is not repeated in the form's Alert.
  return [...(onFields.has(error.message) ? [] : [error.message]), ...leftovers].join(' ');
}
