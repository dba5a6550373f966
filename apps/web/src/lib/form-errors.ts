import type { FieldPath, FieldValues, UseFormSetError } from 'react-hook-form';
import { ApiError } from '@/lib/api-client.ts';

/**
 * Puts the server's per-field messages (`error.fields`) on the form's fields (focusing the
 * first) and returns the message left for the form as a whole, or null when every message
 * found its field.
 */
export function applyServerErrors<T extends FieldValues>(
  error: unknown,
  setError: UseFormSetError<T>,
  fieldNames: readonly FieldPath<T>[],
): string | null {
  if (!(error instanceof ApiError)) return 'Something went wrong. Please try again.';
  const entries = Object.entries(error.fields ?? {});
  const leftover: string[] = [];
  let placed = 0;
  for (const [path, message] of entries) {
    const name = fieldNames.find((f) => f === path || path.startsWith(`${f}.`));
    if (!name) {
      leftover.push(message);
      continue;
    }
    setError(name, { type: 'server', message }, { shouldFocus: placed === 0 });
    placed += 1;
  }
  if (placed > 0 && leftover.length === 0) return null;
  return [error.message, ...leftover].join(' ');
}
