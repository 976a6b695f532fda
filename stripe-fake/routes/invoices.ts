import { Router } from 'express';
import { z } from 'zod';
import type { FakeContext } from '../context';
import { present } from '../expand';
import { listParams, toList } from '../listing';
import { expandParam, parseParams } from '../params';

const retrieveParams = z.strictObject({ expand: expandParam });
const listInvoiceParams = z.strictObject({
  ...listParams,
  customer: z.string().optional(),
  subscription: z.string().optional(),
  status: z.enum(['draft', 'open', 'paid', 'uncollectible', 'void']).optional(),
});

export function invoiceRoutes(ctx: FakeContext): Router {
  const router = Router();

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
