import type { NextFunction, Request, RequestHandler, Response } from 'express';
import type { z } from 'zod';
import { validationFailed } from '../errors';

/** Parses a value with a shared schema; a failure names the first bad field in plain words. */
export function parseWith<S extends z.ZodType>(schema: S, value: unknown): z.infer<S> {
  const result = schema.safeParse(value);
  if (result.success) return result.data;
  const issue = result.error.issues[0]!;
  const field = issue.path.map(String).join('.') || undefined;
  const issues = result.error.issues.map((i) => ({ field: i.path.map(String).join('.'), message: i.message }));
  throw validationFailed(field ? `${field}: ${issue.message}` : issue.message, field, { issues });
}

/** Replaces `req.body` with its parsed, typed form or answers 422. */
export function validateBody(schema: z.ZodType): RequestHandler {
  return (req: Request, _res: Response, next: NextFunction) => {
    req.body = parseWith(schema, req.body ?? {});
    next();
  };
}

/** Parses a positive integer route parameter; anything else is simply not found. */
export function idParam(req: Request, name = 'id'): number {
  const raw = req.params[name];
  const id = typeof raw === 'string' && /^\d{1,10}$/.test(raw) ? Number(raw) : -1;
  return id;
}
