import type { ErrorRequestHandler, RequestHandler } from 'express';
import { UniqueConstraintError } from 'sequelize';
import { ZodError } from 'zod';
import { databaseRetryAfterSeconds, isDatabaseUnavailable } from '../db/availability';
import { AppError } from '../errors';

/** Field paths as the client's forms name them ("steps.2.seconds"), each with its first message. */
export function fieldsFromZod(error: ZodError): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const issue of error.issues) {
    const key = issue.path.length ? issue.path.join('.') : '_';
    if (!fields[key]) fields[key] = issue.message;
  }
  return fields;
}

export const notFoundApi: RequestHandler = (_req, _res, next) => {
  next(new AppError(404, 'not_found', 'No such API route.'));
};

/** The one error handler, registered last: every error leaves as JSON `{ error: { code, message, fields? } }`. */
export const errorHandler: ErrorRequestHandler = (err, req, res, _next) => {
  if (err instanceof ZodError) {
    const fields = fieldsFromZod(err);
    const first = Object.entries(fields)[0];
    res.status(400).json({
      error: {
        code: 'invalid_input',
        message: first ? `Please check ${first[0] === '_' ? 'the request' : first[0]}: ${first[1]}` : 'Invalid input.',
        fields,
      },
    });
    return;
  }
  if (err instanceof AppError) {
    res.status(err.status).json({ error: { code: err.code, message: err.message, ...(err.fields ? { fields: err.fields } : {}), ...err.extra } });
    return;
  }
  // PostgreSQL away (restarting, failing over): the request is fine, so ask the client to retry shortly.
  if (isDatabaseUnavailable(err)) {
    req.log?.warn({ err }, 'database unavailable');
    res.setHeader('Retry-After', String(databaseRetryAfterSeconds));
    res.status(503).json({ error: { code: 'unavailable', message: 'Mendstep cannot reach its database just now. Nothing was lost; try again in a few seconds.' } });
    return;
  }
  // Two requests saving the same thing at once: the unique index lets one through, and the other is told so.
  if (err instanceof UniqueConstraintError || err?.parent?.code === '23505' || err?.code === '23505') {
    res.status(409).json({ error: { code: 'conflict', message: 'Someone else saved this at the same moment. Reload to see their change, then try again.' } });
    return;
  }
  // Errors raised by body-parser, multer and csrf-csrf carry an HTTP status of their own.
  const status = typeof err?.status === 'number' ? err.status : typeof err?.statusCode === 'number' ? err.statusCode : 500;
  if (err?.code === 'EBADCSRFTOKEN') {
    res.status(403).json({ error: { code: 'csrf', message: 'Your page is out of date or the security token is missing. Reload and try again.' } });
    return;
  }
  if (err?.type === 'entity.parse.failed') {
    res.status(400).json({ error: { code: 'invalid_json', message: 'The request body is not valid JSON.' } });
    return;
  }
  if (status >= 400 && status < 500) {
    res.status(status).json({ error: { code: 'bad_request', message: err.expose ? String(err.message) : 'The request was refused.' } });
    return;
  }
  req.log?.error({ err }, 'unhandled error');
  res.status(500).json({ error: { code: 'internal', message: `Something went wrong on our side (request ${String(req.id ?? '')}).` } });
};
