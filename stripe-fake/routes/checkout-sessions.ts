import { Router } from 'express';
import { z } from 'zod';
import type { FakeContext } from '../context';
import { present } from '../expand';
import { listParams, toList } from '../listing';
import { expandParam, formInteger, metadataParam, parseParams } from '../params';
import { createSession, currentSession, openSession } from '../services/checkout';
import type { CheckoutSession } from '../types';

const createParams = z.strictObject({
  mode: z.literal('subscription', { error: 'the local fake sells subscriptions only; use mode=subscription' }),
  customer: z.string().optional(),
  customer_email: z.string().optional(),
  line_items: z.array(z.strictObject({ price: z.string(), quantity: formInteger.min(1) })),
  success_url: z.string().url(),
  cancel_url: z.string().url().optional(),
  client_reference_id: z.string().max(200).optional(),
  metadata: metadataParam.optional(),
  payment_method_types: z.array(z.literal('card')).optional(),
  subscription_data: z.strictObject({ metadata: metadataParam.optional() }).optional(),
  expand: expandParam,
});
const retrieveParams = z.strictObject({ expand: expandParam });
const listSessionParams = z.strictObject({
  ...listParams,
  customer: z.string().optional(),
  subscription: z.string().optional(),
  status: z.enum(['open', 'complete', 'expired']).optional(),
});

export function checkoutSessionRoutes(ctx: FakeContext): Router {
  const router = Router();

  /** The session's items, as `checkout.sessions.listLineItems` and `expand[]=line_items` return them. */
  const lineItems = (session: CheckoutSession) => {
    const order = ctx.state.sessionOrders.get(session.id)!;
    const price = ctx.state.prices.find(order.price);
    const item = {
      id: `li_${session.id.slice('cs_test_'.length, 'cs_test_'.length + 24)}`,
      object: 'item',
      amount_subtotal: session.amount_subtotal,
      amount_total: session.amount_total,
      currency: session.currency,
      description: price.nickname,
      price,
      quantity: order.quantity,
    };
    return toList([item], {}, `/v1/checkout/sessions/${session.id}/line_items`);
  };
  const withLineItems = (session: CheckoutSession, expand: string[] = []) =>
    expand.includes('line_items') ? { ...session, line_items: lineItems(session) } : session;
  const withoutLineItems = (expand: string[] = []) => expand.filter((path) => path !== 'line_items');

  router.post('/checkout/sessions', (req, res) => {
    const { expand, ...request } = parseParams(createParams, req.body);
    const session = createSession(ctx, request);
    res.json(present(ctx.state, withLineItems(session, expand), withoutLineItems(expand)));
  });

  router.get('/checkout/sessions', (req, res) => {
    const { customer, subscription, status, expand, ...page } = parseParams(listSessionParams, req.query);
    const sessions = ctx.state.sessions.newestFirst(
      (session) =>
        (!customer || session.customer === customer) &&
        (!subscription || session.subscription === subscription) &&
        (!status || session.status === status),
    );
    res.json(present(ctx.state, toList(sessions, page, '/v1/checkout/sessions'), expand));
  });

  router.get('/checkout/sessions/:id', (req, res) => {
    const { expand } = parseParams(retrieveParams, req.query);
    const session = currentSession(ctx, req.params.id);
    res.json(present(ctx.state, withLineItems(session, expand), withoutLineItems(expand)));
  });

  // An open session can be closed so it can no longer be paid (the service's `checkout.sessions.expire`).
  router.post('/checkout/sessions/:id/expire', (req, res) => {
    const { expand } = parseParams(retrieveParams, req.body);
    const session = openSession(ctx, req.params.id);
    Object.assign(session, { status: 'expired', url: null } satisfies Partial<CheckoutSession>);
    res.json(present(ctx.state, withLineItems(session, expand), withoutLineItems(expand)));
  });

  router.get('/checkout/sessions/:id/line_items', (req, res) => {
    const { expand, ...page } = parseParams(z.strictObject(listParams), req.query);
    const items = lineItems(ctx.state.sessions.find(req.params.id));
    res.json(present(ctx.state, toList(items.data, page, items.url), expand));
  });

  return router;
}
