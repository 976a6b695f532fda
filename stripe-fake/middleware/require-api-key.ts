import type { RequestHandler } from 'express';
import { FakeStripeError } from '../errors';

function redact(key: string): string {
  return `${key.slice(0, 8)}${'*'.repeat(Math.max(0, key.length - 12))}${key.slice(-4)}`;
}

/**
 * The service's Bearer authentication: a secret test key (or exactly `apiKey` when
 * one is configured), otherwise 401, which the SDK raises as StripeAuthenticationError.
 */
export function requireApiKey(apiKey: string | null, keyPrefix: string): RequestHandler {
  return (req, _res, next) => {
    const header = req.get('authorization') ?? '';
    const key = header.startsWith('Bearer ') ? header.slice('Bearer '.length).trim() : '';
    if (!key) {
      throw new FakeStripeError(401, {
        type: 'invalid_request_error',
        message:
          "You did not provide an API key. You need to provide your API key in the Authorization header, using Bearer auth (e.g. 'Authorization: Bearer YOUR_SECRET_KEY').",
      });
    }
    const accepted = apiKey === null ? key.startsWith(keyPrefix) && key.length > keyPrefix.length : key === apiKey;
    if (!accepted) {
      throw new FakeStripeError(401, { type: 'invalid_request_error', message: `Invalid API Key provided: ${redact(key)}` });
    }
    next();
  };
}
