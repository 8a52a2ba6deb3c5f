import type pg from 'pg';
import type { Logger } from 'pino';

/**
 * Errors that mean "the database cannot be reached just now" rather than "this request is wrong": the server
 * answers them with 503 and Retry-After, and keeps running until PostgreSQL is back.
 * SQLSTATE class 08 is connection exceptions; 57P01–57P03 are admin shutdown, crash shutdown and "cannot
 * connect now" (the server is starting up or shutting down) — PostgreSQL's documented error codes.
 */
const unavailableSqlStates = /^(08|57P0[123])/;
const unavailableNodeCodes = new Set(['ECONNREFUSED', 'ECONNRESET', 'EPIPE', 'ETIMEDOUT', 'EHOSTUNREACH', 'ENOTFOUND']);
const unavailableSequelizeNames = new Set([
  'SequelizeConnectionError',
  'SequelizeConnectionRefusedError',
  'SequelizeConnectionTimedOutError',
  'SequelizeConnectionAcquireTimeoutError',
  'SequelizeHostNotReachableError',
  'SequelizeHostNotFoundError',
]);

export function isDatabaseUnavailable(error: unknown, depth = 0): boolean {
  if (!error || typeof error !== 'object' || depth > 4) return false;
  const e = error as { name?: unknown; code?: unknown; message?: unknown; parent?: unknown; original?: unknown; cause?: unknown; errors?: unknown };
  if (typeof e.name === 'string' && unavailableSequelizeNames.has(e.name)) return true;
  if (typeof e.code === 'string' && (unavailableNodeCodes.has(e.code) || unavailableSqlStates.test(e.code))) return true;
  if (typeof e.message === 'string' && /Connection terminated|terminating connection|the database system is (starting up|shutting down)|Client has encountered a connection error/i.test(e.message)) return true;
  if (Array.isArray(e.errors) && e.errors.some((inner) => isDatabaseUnavailable(inner, depth + 1))) return true;
  return [e.parent, e.original, e.cause].some((inner) => inner !== error && isDatabaseUnavailable(inner, depth + 1));
}

/** Seconds a client is asked to wait before trying again while the database is away. */
export const databaseRetryAfterSeconds = 5;

/**
 * An idle client that loses its connection (PostgreSQL restarting: FATAL 57P01) makes the pool emit 'error';
 * with no listener Node ends the process. The pool drops that client by itself and makes a new one on the next
 * query, so logging is all there is to do.
 */
export function keepPoolAlive(pool: pg.Pool, log: Pick<Logger, 'warn'>): void {
  pool.on('error', (error) => log.warn({ err: error }, 'an idle database connection was lost; it will be replaced on the next query'));
}
