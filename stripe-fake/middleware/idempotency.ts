import type { RequestHandler } from 'express';
import { FakeStripeError } from '../errors';
import type { StoredResponse } from '../store';

/**
 * `Idempotency-Key` on POSTs: the same key with the same parameters replays the first
 * answer; with other parameters it is a 400 idempotency_error. As in the service, an
 * answer is kept only once the request got past validation (success or card error).
 */
export function idempotency(saved: Map<string, StoredResponse>): RequestHandler {
  return (req, res, next) => {
    const key = req.get('idempotency-key');
    if (req.method !== 'POST' || !key) return next();
    const fingerprint = JSON.stringify([req.method, req.originalUrl, req.body ?? {}]);
    const previous = saved.get(key);
    if (previous && previous.fingerprint !== fingerprint) {
      throw new FakeStripeError(400, {
        type: 'idempotency_error',
        message: `Keys for idempotent requests can only be used with the same parameters they were first used with. Try using a key other than '${key}' if you meant to execute a different request.`,
      });
    }
    if (previous) {
      res.set('Idempotent-Replayed', 'true').status(previous.status).json(previous.body);
      return;
    }
    const send = res.json.bind(res);
    res.json = (body: unknown) => {
      if (res.statusCode < 400 || res.statusCode === 402) {
        saved.set(key, { fingerprint, status: res.statusCode, body: structuredClone(body) });
      }
      return send(body);
    };
    next();
  };
}
