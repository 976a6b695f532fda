import { Router } from 'express';
import { z } from 'zod';
import type { FakeContext } from '../context';
import { invalidParam } from '../errors';
import { present } from '../expand';
import { newId } from '../ids';
import { listParams, toList } from '../listing';
import { expandParam, metadataParam, parseParams } from '../params';

const listPaymentParams = z.strictObject({ ...listParams, invoice: z.string() });
const createRefundParams = z.strictObject({
  payment_intent: z.string(),
  reason: z.enum(['duplicate', 'fraudulent', 'requested_by_customer']).optional(),
  metadata: metadataParam.optional(),
  expand: expandParam,
});
const listRefundParams = z.strictObject({ ...listParams, payment_intent: z.string().optional() });

/** Invoice payments and whole refunds of them (`invoicePayments.list`, `refunds.create`, `refunds.list`). */
export function refundRoutes(ctx: FakeContext): Router {
  const router = Router();

  router.get('/invoice_payments', (req, res) => {
    const { invoice, expand, ...page } = parseParams(listPaymentParams, req.query);
    const payments = ctx.state.invoicePayments.newestFirst((p) => p.invoice === invoice);
    res.json(present(ctx.state, toList(payments, page, '/v1/invoice_payments'), expand));
  });

  router.post('/refunds', (req, res) => {
    const { payment_intent, reason, metadata, expand } = parseParams(createRefundParams, req.body);
    const payment = ctx.state.invoicePayments.newestFirst((p) => p.payment.payment_intent === payment_intent)[0];
    if (!payment) throw invalidParam('payment_intent', `No such payment_intent: '${payment_intent}'`, 'resource_missing');
    if (ctx.state.refunds.newestFirst((r) => r.payment_intent === payment_intent).length > 0) {
      throw invalidParam('payment_intent', `Charge for payment_intent '${payment_intent}' has already been refunded.`, 'charge_already_refunded');
    }
    const refund = ctx.state.refunds.add({
      id: newId('re'), object: 'refund', amount: payment.amount_paid, created: ctx.clock.now(), currency: payment.currency,
      metadata: { ...metadata }, payment_intent, reason: reason ?? null, status: 'succeeded',
    });
    res.json(present(ctx.state, refund, expand));
  });

  router.get('/refunds', (req, res) => {
    const { payment_intent, expand, ...page } = parseParams(listRefundParams, req.query);
    const refunds = ctx.state.refunds.newestFirst((r) => !payment_intent || r.payment_intent === payment_intent);
    res.json(present(ctx.state, toList(refunds, page, '/v1/refunds'), expand));
  });

  return router;
}
