import type { NextFunction, Request, RequestHandler, Response } from 'express';
import type { Role } from '../../shared/schemas/auth';
import { forbidden } from '../errors';
import { authOf } from './require-auth';

/** Lets through only the given roles (after requireAuth). */
export function requireRole(...roles: Role[]): RequestHandler {
  const allowed = new Set(roles);
  return (req: Request, _res: Response, next: NextFunction) => {
    if (!allowed.has(authOf(req).user.role)) throw forbidden();
    next();
  };
}
