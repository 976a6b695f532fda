import type { Request, RequestHandler } from 'express';
import { ipKeyGenerator, rateLimit } from 'express-rate-limit';
import type { AppConfig } from '../config';

/**
 * Failed sign-ins are limited per client address and per account; successful
 * ones do not count. Over the limit: 429 with Retry-After, in our error shape.
 */
export function signInLimits(limits: AppConfig['auth']['signInLimits']): RequestHandler[] {
  const common = {
    windowMs: limits.windowMs,
    standardHeaders: 'draft-7' as const,
    legacyHeaders: false,
    skipSuccessfulRequests: true,
    message: {
      error: { code: 'too_many_attempts', message: 'Too many failed sign-in attempts. Wait a few minutes and try again.' },
    },
  };
  const perIp = rateLimit({
    ...common,
    limit: limits.perIp,
    keyGenerator: (req: Request) => ipKeyGenerator(req.ip ?? 'unknown'),
  });
  const perAccount = rateLimit({
    ...common,
    limit: limits.perAccount,
    keyGenerator: (req: Request) => {
      const email: unknown = req.body?.email;
      return `account:${typeof email === 'string' ? email.trim().toLowerCase() : ''}`;
    },
  });
  return [perIp, perAccount];
}
