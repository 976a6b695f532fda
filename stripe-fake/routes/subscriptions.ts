import { Router } from 'express';
import { z } from 'zod';
import type { FakeContext } from '../context';
import { present } from '../expand';
import { listParams, toList } from '../listing';
import { expandParam, formBoolean, formInteger, metadataParam, parseParams } from '../params';
import { changeSubscription, endSubscription } from '../services/subscriptions';

const retrieveParams = z.strictObject({ expand: expandParam });
const listSubscriptionParams = z.strictObject({
  ...listParams,
  customer: z.string().optional(),
  price: z.string().optional(),
  status: z.enum(['active', 'past_due', 'canceled', 'all']).optional(),
});
const updateParams = z.strictObject({
  items: z.array(z.strictObject({ id: z.string().optional(), quantity: formInteger.min(0).optional() })).optional(),
  proration_behavior: z.enum(['create_prorations', 'always_invoice', 'none']).optional(),
  payment_behavior: z.enum(['allow_incomplete', 'error_if_incomplete']).optional(),
  cancel_at_period_end: formBoolean.optional(),
  metadata: metadataParam.optional(),
  expand: expandParam,
});

export function subscriptionRoutes(ctx: FakeContext): Router {
  const router = Router();

  router.get('/subscriptions', (req, res) => {
    const { customer, price, status, expand, ...page } = parseParams(listSubscriptionParams, req.query);
    // Without `status`, the service leaves canceled subscriptions out.
    const subscriptions = ctx.state.subscriptions.newestFirst(
      (subscription) =>
        (!customer || subscription.customer === customer) &&
        (!price || subscription.items.data.some((item) => item.price.id === price)) &&
        (status === 'all' || (status ? subscription.status === status : subscription.status !== 'canceled')),
    );
    res.json(present(ctx.state, toList(subscriptions, page, '/v1/subscriptions'), expand));
  });

  router.get('/subscriptions/:id', (req, res) => {
    const { expand } = parseParams(retrieveParams, req.query);
    res.json(present(ctx.state, ctx.state.subscriptions.find(req.params.id), expand));
  });

  router.post('/subscriptions/:id', (req, res) => {
    const { expand, ...change } = parseParams(updateParams, req.body);
    const subscription = ctx.state.subscriptions.find(req.params.id);
    changeSubscription(ctx, subscription, change);
    res.json(present(ctx.state, subscription, expand));
  });

  router.delete('/subscriptions/:id', (req, res) => {
    const { expand } = parseParams(retrieveParams, req.query);
    const subscription = ctx.state.subscriptions.find(req.params.id);
    endSubscription(ctx, subscription);
    res.json(present(ctx.state, subscription, expand));
  });

  return router;
}
