import type { NextFunction, Request, RequestHandler, Response } from 'express';
import { draftStudy } from '../services/studies/study-store';
import { authOf } from './require-auth';

/**
 * 404 unless `:id` (already checked as an id) is a study of the user's organisation, 409 once it
 * has been started. Put it before a file upload, so foreign ids never get as far as reading the file.
 */
export function requireDraftStudy(): RequestHandler {
  return async (req: Request, _res: Response, next: NextFunction) => {
    await draftStudy(authOf(req).scope, Number(req.params.id));
    next();
  };
}
