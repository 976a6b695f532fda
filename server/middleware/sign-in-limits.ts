import type { Request, RequestHandler } from 'express';
import { ipKeyGenerator, rateLimit } from 'express-rate-limit';
import type { AppConfig } from '../config';
import { tooManyRequests } from '../errors';

const TOO_MANY = 'Too many failed sign-in attempts.';

/**
 * Failed sign-ins slow an account down instead of locking it: after `freeFailures` failures in
 * a row, each further attempt must wait a delay that doubles with every failure (from
 * `baseDelayMs`, at most `maxDelayMs`). An attempt that waited is checked as usual, so the
 * right password always gets in after a short wait and failures cannot be used to keep an
 * owner out for long; guessing stays slow. A success clears the account's count.
 */
export class SignInBackoff {
  private readonly failures = new Map<string, { count: number; lastAt: number }>();

  constructor(
    private readonly limits: { freeFailures: number; baseDelayMs: number; maxDelayMs: number },
    private readonly now: () => number = Date.now,
  ) {}

  /** Milliseconds this account must still wait before its next attempt is checked (0 when none). */
  waitFor(account: string): number {
    const entry = this.failures.get(account);
    if (!entry || entry.count < this.limits.freeFailures) return 0;
    const delay = Math.min(this.limits.baseDelayMs * 2 ** (entry.count - this.limits.freeFailures), this.limits.maxDelayMs);
    return Math.max(0, entry.lastAt + delay - this.now());
  }

  failed(account: string): void {
    const entry = this.failures.get(account);
    this.failures.set(account, { count: (entry?.count ?? 0) + 1, lastAt: this.now() });
    // Forget accounts whose last failure is long past, so the map cannot grow without end.
    if (this.failures.size > 50_000) {
      for (const [key, value] of this.failures) if (this.now() - value.lastAt > this.limits.maxDelayMs * 4) this.failures.delete(key);
    }
  }

  succeeded(account: string): void {
    this.failures.delete(account);
  }

  /** Middleware in front of a credential check: 429 with Retry-After while the account must wait; an answer of `failureStatus` counts as a failure. */
  guard(accountOf: (req: Request) => string, failureStatus = 401): RequestHandler {
    return (req, res, next) => {
      const account = accountOf(req);
      const wait = this.waitFor(account);
      if (wait > 0) {
        throw tooManyRequests('too_many_attempts', `${TOO_MANY} Wait ${Math.ceil(wait / 1000)} seconds and try again.`, Math.ceil(wait / 1000));
      }
      res.once('finish', () => {
        if (res.statusCode === failureStatus) this.failed(account);
        else if (res.statusCode < 400) this.succeeded(account);
      });
      next();
    };
  }
}

/** The account a sign-in names, as the sign-in schema normalises it. */
export const accountOfSignIn = (req: Request): string => {
  const email: unknown = req.body?.email;
  return `account:${typeof email === 'string' ? email.trim().toLowerCase() : ''}`;
};

/**
 * Failed sign-ins are limited per client address (a window of `perIp` failures; successful
 * ones do not count) and slowed down per account (`SignInBackoff`). Over a limit: 429 with
 * Retry-After, in our error shape.
 */
export function signInLimits(limits: AppConfig['auth']['signInLimits'], backoff: SignInBackoff): RequestHandler[] {
  const perIp = rateLimit({
    windowMs: limits.windowMs,
    standardHeaders: 'draft-7',
    legacyHeaders: false,
    skipSuccessfulRequests: true,
    limit: limits.perIp,
    keyGenerator: (req: Request) => ipKeyGenerator(req.ip ?? 'unknown'),
    message: { error: { code: 'too_many_attempts', message: `${TOO_MANY} Wait a few minutes and try again.` } },
  });
  return [perIp, backoff.guard(accountOfSignIn)];
}

/** Sign-ups are limited per client address and per e-mail address, whatever their outcome (the answer is always the same). */
export function signUpLimits(limits: AppConfig['auth']['signUpLimits']): RequestHandler[] {
  const hourly = (limit: number, key: (req: Request) => string) => rateLimit({
    windowMs: 3600_000,
    limit,
    standardHeaders: 'draft-7',
    legacyHeaders: false,
    keyGenerator: key,
    message: { error: { code: 'too_many_sign_ups', message: 'Too many accounts were asked for from here in the last hour. Try again later.' } },
  });
  return [hourly(limits.perIpPerHour, (req) => ipKeyGenerator(req.ip ?? 'unknown')), hourly(limits.perAddressPerHour, accountOfSignIn)];
}
