import type { NextFunction, Request, Response } from 'express';
import { isConnectionLoss, isLockFailure, isUniqueViolation } from '../db-errors';
import { AppError } from '../errors';
import { recordFailure } from './request-log';

interface HttpLikeError {
  status?: number;
  type?: string;
}

interface Answer {
  status: number;
  body: { code: string; message: string; field?: string; details?: unknown };
  retryAfterSeconds?: number;
}

/**
 * Turns any error into `{ error: { code, message, field? } }`, the one place where errors
 * become statuses: a unique key → 409, a lost database → 503 with Retry-After, a deadlock → 503.
 * Never sends a stack or a driver message; the request log records the error's codes
 * (see server/middleware/request-log.ts), never its values.
 */
export function errorHandler(err: unknown, _req: Request, res: Response, _next: NextFunction): void {
  const answer = describe(err);
  // The request log picks the error up from here (its codes and frames only).
  if (answer.status >= 500) recordFailure(res, err);
  if (res.headersSent) return;
  if (answer.retryAfterSeconds !== undefined) res.setHeader('Retry-After', String(answer.retryAfterSeconds));
  // A download route may have named its file type before the error came (`res.type('png').send(await …)`): the error is JSON, and no attachment.
  res.removeHeader('Content-Disposition');
  res.status(answer.status).type('json').json({ error: answer.body });
}

function describe(err: unknown): Answer {
  if (err instanceof AppError) {
    const body: Answer['body'] = { code: err.code, message: err.message };
    if (err.field) body.field = err.field;
    if (err.details !== undefined) body.details = err.details;
    return { status: err.status, body, retryAfterSeconds: err.retryAfterSeconds };
  }
  // MariaDB rolled the whole transaction back, so nothing was stored; the same request may simply be sent again.
  if (isLockFailure(err)) {
    return { status: 503, retryAfterSeconds: 1, body: { code: 'busy', message: 'Another change to the same records was being saved at that moment; nothing was changed. Please try again.' } };
  }
  if (isUniqueViolation(err)) {
    return { status: 409, body: { code: 'conflict', message: 'The same record was saved by another request at that moment; nothing was changed. Reload to see it.' } };
  }
  if (isConnectionLoss(err)) {
    return { status: 503, retryAfterSeconds: 5, body: { code: 'database_unavailable', message: 'The database cannot be reached just now. Please try again in a few seconds.' } };
  }
  const e = (err ?? {}) as HttpLikeError;
  if (e.type === 'entity.too.large') return { status: 413, body: { code: 'too_large', message: 'The request body is too large.' } };
  if (e.type === 'entity.parse.failed') return { status: 400, body: { code: 'bad_json', message: 'The request body is not valid JSON.' } };
  if (typeof e.status === 'number' && e.status >= 400 && e.status < 500) {
    return { status: e.status, body: { code: 'bad_request', message: 'The request could not be understood.' } };
  }
  return { status: 500, body: { code: 'internal', message: 'Something went wrong on our side. Please try again.' } };
}

/** 404 for unknown API paths, in the same error shape. */
export function apiNotFound(_req: Request, res: Response): void {
  res.status(404).json({ error: { code: 'not_found', message: 'No such API route.' } });
}
