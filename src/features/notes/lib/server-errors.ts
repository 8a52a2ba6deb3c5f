import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';
import { ApiError } from '../../../lib/api-client';

/** A 400 names the fields at fault: each message goes beside its box; anything else goes above the form. */
export function placeServerError<F extends FieldValues>(error: unknown, fields: readonly Path<F>[], setError: UseFormSetError<F>) {
  if (!(error instanceof ApiError)) {
    setError('root.server' as Path<F>, { message: 'Could not reach Mendstep. Check the connection and try again.' });
    return;
  }
  const named = Object.entries(error.fields ?? {}).filter(([name]) => (fields as readonly string[]).includes(name));
  for (const [name, message] of named) setError(name as Path<F>, { message });
  if (named.length === 0) setError('root.server' as Path<F>, { message: error.message });
}
