import type { RequestHandler } from 'express';
import type { z } from 'zod';
import { findUnsafeText, unsafeTextMessage } from '../../shared/text-safety';
import { AppError } from '../errors';

/**
 * Validation at the edge: parse a request part with a shared zod schema.
 * A failure throws the ZodError, which the error middleware answers with 400 and the fields at fault.
 */
export function parseInput<S extends z.ZodType>(schema: S, data: unknown): z.infer<S> {
  return schema.parse(data);
}

/**
 * The net under the shared schemas: a JSON body or query string holding NUL or a lone surrogate anywhere is
 * refused with 400 naming the field, before any service or database sees it (PostgreSQL's JSONB refuses such
 * text with an error that would otherwise surface as a 500, and table mode retries a 500 for ever).
 */
export const refuseUnsafeText: RequestHandler = (req, _res, next) => {
  const found = findUnsafeText(req.body) ?? findUnsafeText(req.query);
  if (!found) {
    next();
    return;
  }
  const field = found.length ? found.join('.') : '_';
  next(new AppError(400, 'invalid_input', `Please check ${field === '_' ? 'the request' : field}: it ${unsafeTextMessage}.`, { [field]: `This ${unsafeTextMessage}` }));
};
