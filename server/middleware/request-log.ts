import { randomUUID } from 'node:crypto';
import { performance } from 'node:perf_hooks';
import type { RequestHandler, Response } from 'express';
import type { Logger } from '../logger';

const REQUEST_ID = /^[A-Za-z0-9._-]{8,64}$/;

/** Opaque path segments (a pending upload's token) are credentials of a kind: the log keeps their place, not their value. */
const maskTokens = (path: string) => path.replace(/\/[A-Za-z0-9_-]{20,}(?=\/|$)/g, '/…');

/** The error the error handler answered a 5xx for (server/middleware/error-handler.ts), kept for the request's log line. */
export const recordFailure = (res: Response, error: unknown): void => {
  res.locals.failure = error;
};

/**
 * One log line per request (health probes aside), written once the answer is sent: request id,
 * method, path without its query string (links carry tokens there), the matched route, status
 * and duration. Headers, bodies and client addresses are never logged. A request id a proxy sent
 * (`X-Request-Id`) is kept, otherwise one is made, and it is sent back so a user's report can be
 * matched to the line. One plain call on the shared logger per request: a per-request child
 * logger (as pino-http makes) cost a quarter of a signed-in read's CPU time under load.
 */
export function requestLog(logger: Logger): RequestHandler {
  return (req, res, next) => {
    // Health probes come every few seconds from every balancer: noise in the log, and a third of their cost.
    if (req.method === 'GET' && req.path === '/api/health') return next();
    const started = performance.now();
    const sent = req.headers['x-request-id'];
    const id = typeof sent === 'string' && REQUEST_ID.test(sent) ? sent : randomUUID();
    res.setHeader('X-Request-Id', id);
    res.once('close', () => {
      const failure: unknown = res.locals.failure;
      const line = {
        req: { id, method: req.method, path: maskTokens(req.originalUrl.split('?')[0]!) },
        res: { statusCode: res.statusCode },
        route: res.locals.route as string | undefined,
        responseTime: Math.round(performance.now() - started),
        // The logger's own serializer keeps only the error's kind, codes and frames (server/logger.ts).
        ...(failure === undefined ? {} : { err: failure }),
      };
      if (!res.writableFinished) logger.warn(line, 'request aborted');
      else if (failure !== undefined || res.statusCode >= 500) logger.error(line, 'request failed');
      else if (res.statusCode >= 400) logger.warn(line, 'request');
      else logger.info(line, 'request');
    });
    next();
  };
}

/** Names the matched route for the request log (first handler of every route in the table). */
export const markRoute = (route: string): RequestHandler => (_req, res, next) => {
  res.locals.route = route;
  next();
};
