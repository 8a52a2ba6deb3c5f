import type { z } from 'zod';

/**
 * Validation at the edge: parse a request part with a shared zod schema.
 * A failure throws the ZodError, which the error middleware answers with 400 and the fields at fault.
 */
export function parseInput<S extends z.ZodType>(schema: S, data: unknown): z.infer<S> {
  return schema.parse(data);
}
