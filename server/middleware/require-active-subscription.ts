import type { NextFunction, Request, RequestHandler, Response } from 'express';
import type { AppContext } from '../context';
import { authOf } from './require-auth';

/**
 * Lets a request through only when the organisation has an active seat plan; otherwise
 * 402 `subscription_required`. Put it after requireAuth in front of paid actions
 * (starting a run); reading stays open without a plan.
 */
export function requireActiveSubscription(ctx: AppContext): RequestHandler {
  return async (req: Request, _res: Response, next: NextFunction) => {
    await ctx.billing.assertCanUsePaidFeatures(authOf(req).scope);
    next();
  };
}
