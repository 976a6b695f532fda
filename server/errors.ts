/** Errors the services throw; the error handler turns them into `{ error: { code, message, field? } }`. */
export class AppError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly field?: string,
    readonly details?: unknown,
    /** Seconds after which the same request may be sent again (`Retry-After`). */
    readonly retryAfterSeconds?: number,
  ) {
    super(message);
    this.name = 'AppError';
  }
}

export const badRequest = (message: string, field?: string, details?: unknown) =>
  new AppError(400, 'bad_request', message, field, details);
export const validationFailed = (message: string, field?: string, details?: unknown) =>
  new AppError(422, 'validation_failed', message, field, details);
export const unauthorized = (message = 'Please sign in.') => new AppError(401, 'unauthorized', message);
export const forbidden = (message = 'Your role does not allow this.') => new AppError(403, 'forbidden', message);
export const notFound = (what = 'Resource') => new AppError(404, 'not_found', `${what} not found.`);
export const conflict = (message: string, field?: string) => new AppError(409, 'conflict', message, field);
export const paymentRequired = (message: string) => new AppError(402, 'subscription_required', message);
export const upstreamUnavailable = (message: string) => new AppError(503, 'upstream_unavailable', message);
export const tooManyRequests = (code: string, message: string, retryAfterSeconds: number) =>
  new AppError(429, code, message, undefined, undefined, retryAfterSeconds);
