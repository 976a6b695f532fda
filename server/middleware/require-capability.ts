import type { NextFunction, Request, RequestHandler, Response } from 'express';
import { allows, type Access } from '../../shared/access/capabilities';
import { forbidden } from '../errors';
import { authOf } from './require-auth';

/** Lets through only roles the capability table gives this access (after requireAuth). */
export function requireCapability(access: Access): RequestHandler {
  return (req: Request, _res: Response, next: NextFunction) => {
    if (!allows(authOf(req).user.role, access)) throw forbidden();
    next();
  };
}
