import Stripe from 'stripe';
import type { AppConfig } from '../../config';
import { AppError, upstreamUnavailable } from '../../errors';

/** The payment service's SDK, pointed at the host in the config (the local fake in development and tests). */
export function createPaymentsClient(billing: AppConfig['billing']): Stripe {
  return new Stripe(billing.secretKey, {
    host: billing.host,
    port: billing.port,
    protocol: billing.protocol,
    // Our own calls are not retried: a failure answers the admin at once and changes nothing here.
    maxNetworkRetries: 0,
    timeout: 10_000,
    telemetry: false,
  });
}

const UNREACHABLE = 'The payment service cannot be reached just now; nothing was changed. Try again in a minute.';

/** Runs one SDK call and turns its failures into errors the API answers with. */
export async function callPayments<T>(call: () => Promise<T>): Promise<T> {
  try {
    return await call();
  } catch (error) {
    throw toAppError(error);
  }
}

export function toAppError(error: unknown): unknown {
  if (!(error instanceof Stripe.errors.StripeError)) return error;
  switch (error.type) {
    case 'StripeCardError':
      return new AppError(402, 'card_declined', `The card was declined (${error.message}); nothing was changed.`);
    case 'StripeConnectionError':
    case 'StripeAPIError':
    case 'StripeRateLimitError':
      return upstreamUnavailable(UNREACHABLE);
    default:
      return new AppError(502, 'payment_service_error', `The payment service refused the request: ${error.message}`);
  }
}
