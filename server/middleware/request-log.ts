import { randomUUID } from 'node:crypto';
import type { IncomingMessage, ServerResponse } from 'node:http';
import type { RequestHandler, Response } from 'express';
import { pinoHttp } from 'pino-http';
import { safeError, type Logger } from '../logger';

const REQUEST_ID = /^[A-Za-z0-9._-]{8,64}$/;

/** Opaque path segments (a pending upload's token) are credentials of a kind: the log keeps their place, not their value. */
const maskTokens = (path: string) => path.replace(/\/[A-Za-z0-9_-]{20,}(?=\/|$)/g, '/…');

/** The route a request matched, as the route table names it (`put /api/catchments/:id`), set by `markRoute`. */
const routeOf = (res: ServerResponse): string | undefined => (res as Response).locals?.route as string | undefined;

/**
 * One log line per request (health probes aside): request id, method, path without its query string (links carry
 * tokens there), the matched route, status and duration. Headers, bodies and client addresses
 * are never logged. A request id a proxy sent (`X-Request-Id`) is kept, otherwise one is made,
 * and it is sent back so a user's report can be matched to the line.
 */
export function requestLog(logger: Logger): RequestHandler {
  const log = pinoHttp({
    logger,
    genReqId: (req: IncomingMessage, res: ServerResponse) => {
      const sent = req.headers['x-request-id'];
      const id = typeof sent === 'string' && REQUEST_ID.test(sent) ? sent : randomUUID();
      res.setHeader('X-Request-Id', id);
      return id;
    },
    // Our serializers see the raw objects; the standard ones would copy headers and an error's message.
    wrapSerializers: false,
    serializers: {
      req: (req: IncomingMessage & { id: unknown; originalUrl?: string }) => ({ id: req.id, method: req.method, path: maskTokens((req.originalUrl ?? req.url ?? '').split('?')[0]!) }),
      res: (res: ServerResponse) => ({ statusCode: res.statusCode }),
      err: safeError,
    },
    customProps: (_req, res) => ({ route: routeOf(res) }),
    customLogLevel: (_req, res, error) => (error || res.statusCode >= 500 ? 'error' : res.statusCode >= 400 ? 'warn' : 'info'),
    customSuccessMessage: () => 'request',
    customErrorMessage: () => 'request failed',
  }) as unknown as RequestHandler;
  // Health probes come every few seconds from every balancer: noise in the log, and a third of their cost.
  return (req, res, next) => (req.method === 'GET' && req.path === '/api/health' ? next() : log(req, res, next));
}

/** Names the matched route for the request log (first handler of every route in the table). */
export const markRoute = (route: string): RequestHandler => (_req, res, next) => {
  res.locals.route = route;
  next();
};
