import type { ErrorRequestHandler, RequestHandler } from 'express';

export type ErrorType = 'invalid_request_error' | 'card_error' | 'idempotency_error' | 'api_error';

export interface ErrorBody {
  type: ErrorType;
  message: string;
  code?: string;
  param?: string;
  decline_code?: string;
}

/** An error the fake answers in the service's shape: `{ error: { type, code, message, param } }`. */
export class FakeStripeError extends Error {
  constructor(
    readonly status: number,
    readonly body: ErrorBody,
  ) {
    super(body.message);
  }
}

export function missingParam(param: string): FakeStripeError {
  return new FakeStripeError(400, {
    type: 'invalid_request_error',
    code: 'parameter_missing',
    message: `Missing required param: ${param}.`,
    param,
  });
}

export function invalidParam(param: string, message: string, code = 'parameter_invalid'): FakeStripeError {
  return new FakeStripeError(400, { type: 'invalid_request_error', code, message, param });
}

export function unknownParam(param: string): FakeStripeError {
  return new FakeStripeError(400, {
    type: 'invalid_request_error',
    code: 'parameter_unknown',
    message: `Received unknown parameter: ${param}`,
    param,
  });
}

/**
 * A missing object. Looked up from the URL it is a 404; named in a body parameter
 * the service answers 400 with that parameter set.
 */
export function noSuch(resource: string, id: string, param?: string): FakeStripeError {
  return new FakeStripeError(param ? 400 : 404, {
    type: 'invalid_request_error',
    code: 'resource_missing',
    message: `No such ${resource}: '${id}'`,
    ...(param ? { param } : {}),
  });
}

export function invalidState(message: string, param?: string): FakeStripeError {
  return new FakeStripeError(400, {
    type: 'invalid_request_error',
    message,
    ...(param ? { param } : {}),
  });
}

export const unknownRoute: RequestHandler = (req) => {
  throw new FakeStripeError(404, {
    type: 'invalid_request_error',
    message: `Unrecognized request URL (${req.method}: ${req.originalUrl.split('?')[0]}).`,
  });
};

export const errorHandler: ErrorRequestHandler = (error, _req, res, next) => {
  if (res.headersSent) return next(error);
  if (error instanceof FakeStripeError) {
    res.status(error.status).json({ error: error.body });
    return;
  }
  // Body-parser errors (malformed body) carry a 4xx status of their own.
  const status = typeof error?.status === 'number' && error.status < 500 ? error.status : 500;
  const message = status < 500 ? `Invalid request: ${error.message}` : 'The local payment fake failed.';
  if (status >= 500) console.error('[stripe-fake]', error);
  res.status(status).json({ error: { type: status < 500 ? 'invalid_request_error' : 'api_error', message } });
};
