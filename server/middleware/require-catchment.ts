import type { NextFunction, Request, RequestHandler, Response } from 'express';
import type { AppContext } from '../context';
import { authOf } from './require-auth';

/**
 * 404 unless `:catchmentId` (already checked as an id) is a catchment of the user's organisation.
 * Put it before a file upload, so foreign ids never get as far as reading the file.
 */
export function requireCatchment(ctx: AppContext): RequestHandler {
  return async (req: Request, _res: Response, next: NextFunction) => {
    await ctx.catchments.get(authOf(req).scope, Number(req.params.catchmentId));
    next();
  };
}
