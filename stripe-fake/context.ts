import type { FakeClock } from './clock';
import type { FakeStripeState } from './store';
import type { WebhookSender } from './webhooks/sender';

/** Everything a service of the fake works on; one per running fake. */
export interface FakeContext {
  state: FakeStripeState;
  clock: FakeClock;
  webhooks: WebhookSender;
  /** The origin the fake is reached at, for `url`, `hosted_invoice_url` and `invoice_pdf`. */
  publicUrl: string;
  apiVersion: string;
}
