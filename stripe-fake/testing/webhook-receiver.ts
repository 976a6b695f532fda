import { createServer } from 'node:http';
import type { AddressInfo } from 'node:net';
import Stripe from 'stripe';

export interface WebhookReceiver {
  url: string;
  /** Events that arrived with a valid signature and were answered 200, in arrival order. */
  events: Stripe.Event[];
  /** Every request, with the status the receiver answered. */
  requests: { status: number; type: string | null }[];
  /** Answer the next `count` requests with 500, as a receiver that is briefly broken. */
  failNext(count: number): void;
  close(): Promise<void>;
}

/**
 * A minimal webhook endpoint for tests: checks each request with the SDK's
 * `constructEvent` and the shared secret, exactly as our server's webhook route must.
 */
export function startWebhookReceiver(secret: string): Promise<WebhookReceiver> {
  const stripe = new Stripe('sk_test_receiver', { telemetry: false });
  const events: Stripe.Event[] = [];
  const requests: WebhookReceiver['requests'] = [];
  let failures = 0;

  const server = createServer((req, res) => {
    const chunks: Buffer[] = [];
    req.on('data', (chunk: Buffer) => chunks.push(chunk));
    req.on('end', () => {
      let status = 200;
      let type: string | null = null;
      try {
        const event = stripe.webhooks.constructEvent(Buffer.concat(chunks), String(req.headers['stripe-signature']), secret);
        type = event.type;
        if (failures > 0) {
          failures -= 1;
          status = 500;
        } else {
          events.push(event);
        }
      } catch {
        status = 400;
      }
      requests.push({ status, type });
      res.writeHead(status, { 'Content-Type': 'application/json' }).end(JSON.stringify({ received: status === 200 }));
    });
  });

  return new Promise((resolve) => {
    server.listen(0, '127.0.0.1', () => {
      const { port } = server.address() as AddressInfo;
      resolve({
        url: `http://127.0.0.1:${port}/webhook`,
        events,
        requests,
        failNext(count) {
          failures = count;
        },
        close: () => new Promise((done) => server.close(() => done())),
      });
    });
  });
}
