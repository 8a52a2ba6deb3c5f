import type { z } from 'zod';

/** The issues of a failed parse as { path, message }, so tests can assert on the field a message points at. */
export function issuesOf(result: z.ZodSafeParseResult<unknown>): { path: string; message: string }[] {
  if (result.success) return [];
  return result.error.issues.map((issue) => ({ path: issue.path.join('.'), message: issue.message }));
}
