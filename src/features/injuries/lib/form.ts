import { zodResolver } from '@hookform/resolvers/zod';
import type { FieldErrors, FieldValues, Path, Resolver, UseFormSetError } from 'react-hook-form';
import type { z } from 'zod';
import { ApiError } from '../../../lib/api-client';

/**
 * Inputs hold text ("", "80", a datetime-local value) while the shared schema wants numbers, nulls and ISO
 * instants. `toInput` converts once, then the shared schema validates exactly as the server will. Fields left
 * empty get the plain-words message from `emptyMessages` instead of the schema's format message.
 */
export function convertingResolver<F extends FieldValues, S extends z.ZodType<unknown, FieldValues>>(
  schema: S,
  toInput: (values: F) => z.input<S>,
  emptyMessages: Partial<Record<Path<F>, string>> = {},
): Resolver<F, unknown, z.output<S>> {
  const resolve = zodResolver(schema as never) as unknown as Resolver<FieldValues, unknown, z.output<S>>;
  return async (values, context, options) => {
    const result = await resolve(toInput(values), context, options as never);
    const errors = result.errors as Record<string, { type: string; message?: string } | undefined>;
    for (const [field, message] of Object.entries(emptyMessages) as [string, string][]) {
      if (errors[field] && (values as Record<string, unknown>)[field] === '') errors[field] = { type: 'required', message };
    }
    // A refinement over the whole form has an empty path; react-hook-form keeps form-wide errors under `root`.
    if (errors['']) {
      errors.root = errors[''];
      delete errors[''];
    }
    return result as unknown as ReturnType<Resolver<F, unknown, z.output<S>>>;
  };
}

/**
 * A server 400 names the fields at fault; put each message beside its input, and anything the form has no
 * input for at the top of the form.
 */
export function showServerErrors<F extends FieldValues>(error: unknown, fieldNames: readonly Path<F>[], setError: UseFormSetError<F>): void {
  const message = error instanceof ApiError ? error.message : 'Could not reach Mendstep. Check the connection and try again.';
  const fields = error instanceof ApiError ? (error.fields ?? {}) : {};
  let placed = false;
  for (const [name, fieldMessage] of Object.entries(fields)) {
    if ((fieldNames as readonly string[]).includes(name)) {
      setError(name as Path<F>, { type: 'server', message: fieldMessage });
      placed = true;
    }
  }
  if (!placed) setError('root.server' as Path<F>, { type: 'server', message });
}

/** The form-wide message to show above a form, if any. */
export function formWideError<F extends FieldValues>(errors: FieldErrors<F>): string | undefined {
  return errors.root?.server?.message ?? errors.root?.message;
}
