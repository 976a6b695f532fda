import { Router } from 'express';
import { z } from 'zod';
import type { FakeContext } from '../context';
import { present } from '../expand';
import { invalidParam } from '../errors';
import { listParams, toList } from '../listing';
import { expandParam, formInteger, parseParams } from '../params';
import { previewSubscriptionChange } from '../services/subscriptions';

const retrieveParams = z.strictObject({ expand: expandParam });
const listInvoiceParams = z.strictObject({
  ...listParams,
  customer: z.string().optional(),
  subscription: z.string().optional(),
  status: z.enum(['draft', 'open', 'paid', 'uncollectible', 'void']).optional(),
});

const previewParams = z.strictObject({
  customer: z.string().optional(),
  subscription: z.string(),
  subscription_details: z.strictObject({
    items: z.array(z.strictObject({ id: z.string().optional(), quantity: formInteger.min(0).optional() })).optional(),
    proration_behavior: z.enum(['create_prorations', 'always_invoice', 'none']).optional(),
    proration_date: formInteger.optional(),
  }).optional(),
  expand: expandParam,
});

export function invoiceRoutes(ctx: FakeContext): Router {
  const router = Router();

  // Before /invoices/:id. Previews a subscription change; nothing is stored or charged.
  router.post('/invoices/create_preview', (req, res) => {
    const { subscription: id, subscription_details: details = {}, customer, expand } = parseParams(previewParams, req.body);
    const subscription = ctx.state.subscriptions.find(id);
    if (customer && customer !== subscription.customer) throw invalidParam('customer', `The subscription ${id} belongs to another customer.`);
    res.json(present(ctx.state, previewSubscriptionChange(ctx, subscription, details), expand));
  });

  router.get('/invoices', (req, res) => {
    const { customer, subscription, status, expand, ...page } = parseParams(listInvoiceParams, req.query);
    const invoices = ctx.state.invoices.newestFirst(
      (invoice) =>
        (!customer || invoice.customer === customer) &&
        (!subscription || invoice.subscription === subscription) &&
        (!status || invoice.status === status),
    );
    res.json(present(ctx.state, toList(invoices, page, '/v1/invoices'), expand));
  });

  router.get('/invoices/:id', (req, res) => {
    const { expand } = parseParams(retrieveParams, req.query);
    res.json(present(ctx.state, ctx.state.invoices.find(req.params.id), expand));
  });

  router.get('/invoices/:id/lines', (req, res) => {
    const { expand, ...page } = parseParams(z.strictObject(listParams), req.query);
    const invoice = ctx.state.invoices.find(req.params.id);
    res.json(present(ctx.state, toList(invoice.lines.data, page, invoice.lines.url), expand));
  });

  return router;
}
