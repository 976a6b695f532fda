import Stripe from 'stripe';

/**
 * The service's signature header, `t=<unix>,v1=<hex HMAC-SHA256 of "t.payload">`, made
 * by the SDK's own helper so it verifies exactly as `stripe.webhooks.constructEvent` expects.
 * The timestamp is wall-clock time: receivers reject signatures older than 300 s,
 * whatever the fake's billing clock says.
 */
export function signPayload(payload: string, secret: string): string {
  return Stripe.webhooks.generateTestHeaderString({
    payload,
    secret,
    timestamp: Math.floor(Date.now() / 1000),
  });
}
