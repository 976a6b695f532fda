import { randomUUID } from 'node:crypto';
import type { Knex } from 'knex';
import type Stripe from 'stripe';
import type { CheckoutRequest } from '../../../shared/schemas/billing';
import { conflict } from '../../errors';
import { callPayments } from './payments-client';

interface PendingRow {
  organisation_id: number;
  billing_interval: CheckoutRequest['interval'];
  seats: number;
  idem_key: string;
  session_ref: string | null;
  url: string | null;
}

/**
 * One open checkout per organisation. Inside the caller's transaction, which holds the
 * organisation's lock: the same plan asked for again gets the page already open; another plan
 * closes that page at the service first, so two checkouts can never both be paid. The session is
 * created with an idempotency key kept in the row, so a request retried after a lost answer
 * gets the same session back.
 */
export async function openCheckoutOnce(
  trx: Knex.Transaction,
  payments: Stripe,
  organisationId: number,
  request: CheckoutRequest,
  create: (idempotencyKey: string) => Promise<Stripe.Checkout.Session>,
): Promise<string> {
  const pending = (await trx('pending_checkouts').where({ organisation_id: organisationId }).first()) as PendingRow | undefined;
  const samePlan = pending && pending.billing_interval === request.interval && pending.seats === request.seats;
  if (pending?.session_ref) {
    const session = await callPayments(() => payments.checkout.sessions.retrieve(pending.session_ref!));
    if (session.status === 'complete') throw conflict('The seat plan is paid; it appears here as soon as the payment service confirms it.');
    if (session.status === 'open' && samePlan && session.url) return session.url;
    if (session.status === 'open') await callPayments(() => payments.checkout.sessions.expire(session.id));
  }
  // The same plan whose create never answered keeps its key: the service hands back that session.
  const key = samePlan && !pending.session_ref ? pending.idem_key : randomUUID();
  await trx('pending_checkouts').where({ organisation_id: organisationId }).delete();
  await trx('pending_checkouts').insert({ organisation_id: organisationId, billing_interval: request.interval, seats: request.seats, idem_key: key });
  const session = await create(key);
  if (!session.url) throw conflict('The payment service did not return a checkout page.');
  await trx('pending_checkouts').where({ organisation_id: organisationId }).update({
    session_ref: session.id, url: session.url, expires_at: session.expires_at ? new Date(session.expires_at * 1000) : null,
  });
  return session.url;
}
