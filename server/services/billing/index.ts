import type { Knex } from 'knex';
import type Stripe from 'stripe';
import type { AppConfig } from '../../config';
import type { Logger } from '../../logger';
import { BillingService } from './billing-service';
import { createPaymentsClient } from './payments-client';
import { WebhookService } from './webhook-service';

export interface BillingServices {
  payments: Stripe;
  billing: BillingService;
  webhooks: WebhookService;
}

/** Seat plans through the payment service's SDK, and the webhooks that keep our table in step. */
export function createBillingServices(deps: { config: AppConfig; db: Knex; logger: Logger }): BillingServices {
  const payments = createPaymentsClient(deps.config.billing);
  return {
    payments,
    billing: new BillingService(deps.db, payments, deps.config),
    webhooks: new WebhookService(deps.db, payments, deps.config.billing.webhookSecret, deps.logger),
  };
}
