import type { NextFunction, Request, Response } from 'express';
import { AppError } from '../errors';

interface HttpLikeError {
  status?: number;
  type?: string;
  code?: string;
}

/** Turns any error into `{ error: { code, message, field? } }`; never sends a stack trace. */
export function errorHandler(err: unknown, _req: Request, res: Response, _next: NextFunction): void {
  const { status, body } = describe(err);
  if (status >= 500) console.error('[tarnish] request failed:', err);
  if (res.headersSent) return;
  res.status(status).json({ error: body });
}

function describe(err: unknown): { status: number; body: { code: string; message: string; field?: string; details?: unknown } } {
  if (err instanceof AppError) {
    const body: { code: string; message: string; field?: string; details?: unknown } = { code: err.code, message: err.message };
    if (err.field) body.field = err.field;
    if (err.details !== undefined) body.details = err.details;
    return { status: err.status, body };
  }
  const e = (err ?? {}) as HttpLikeError;
  // MariaDB rolled the whole transaction back, so nothing was stored; the same request may simply be sent again.
  if (e.code === 'ER_LOCK_DEADLOCK' || e.code === 'ER_LOCK_WAIT_TIMEOUT') {
    return { status: 503, body: { code: 'busy', message: 'Another change to the same records was being saved at that moment; nothing was changed. Please try again.' } };
  }
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
