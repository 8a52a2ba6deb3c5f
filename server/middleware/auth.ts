import type { RequestHandler } from 'express';
import type { Role } from '../../shared/auth/roles';
import type { SessionUser } from '../../shared/auth/schemas';
import { AppError } from '../errors';

export const requireSignIn: RequestHandler = (req, _res, next) => {
  if (!req.user) return next(AppError.unauthorized());
  next();
};

/** Role guard for a route; clinic scoping is the services' job. */
export function requireRole(...allowed: Role[]): RequestHandler {
  return (req, _res, next) => {
    if (!req.user) return next(AppError.unauthorized());
    if (!allowed.includes(req.user.role)) return next(AppError.forbidden());
    next();
  };
}

/** The signed-in user of a route that sits behind requireSignIn. */
export function currentUser(req: Express.Request): SessionUser {
  if (!req.user) throw AppError.unauthorized();
  return req.user;
}
