import express, { Router } from 'express';
import { checkoutRequestSchema, resizeRequestSchema } from '../../shared/schemas/billing';
import type { AppContext } from '../context';
import { authOf, requireAuth } from '../middleware/require-auth';
import { requireRole } from '../middleware/require-role';
import { validateBody } from '../middleware/validate';

/** /api/billing/*: the seat plan, for admins. */
export function billingRoutes(ctx: AppContext): Router {
  const router = Router();
  const { billing } = ctx;
  router.use('/billing', requireAuth(ctx), requireRole('admin'));

  router.get('/billing', async (req, res) => {
    res.json(await billing.summary(authOf(req).scope));
  });

  router.get('/billing/plans', async (_req, res) => {
    res.json({ plans: await billing.plans() });
  });

  router.post('/billing/checkout', validateBody(checkoutRequestSchema), async (req, res) => {
    const { user, scope } = authOf(req);
    res.status(201).json({ url: await billing.startCheckout(scope, user, req.body) });
  });

  router.put('/billing/seats', validateBody(resizeRequestSchema), async (req, res) => {
    res.json({ subscription: await billing.resize(authOf(req).scope, req.body.seats) });
  });

  router.post('/billing/cancel', async (req, res) => {
    res.json({ subscription: await billing.setCancelAtPeriodEnd(authOf(req).scope, true) });
  });

  router.post('/billing/resume', async (req, res) => {
    res.json({ subscription: await billing.setCancelAtPeriodEnd(authOf(req).scope, false) });
  });

  router.get('/billing/invoices', async (req, res) => {
    res.json({ invoices: await billing.invoices(authOf(req).scope) });
  });

  return router;
}

/**
 * POST /api/billing/webhook: events from the payment service. Mounted before the JSON
 * parser because the signature covers the exact bytes received.
 */
export function billingWebhookRoute(ctx: AppContext): Router {
  const router = Router();
  router.post('/api/billing/webhook', express.raw({ type: '*/*', limit: '256kb' }), async (req, res) => {
    const body = Buffer.isBuffer(req.body) ? req.body : Buffer.alloc(0);
    const event = ctx.webhooks.verify(body, req.get('stripe-signature'));
    const applied = await ctx.webhooks.receive(event);
    res.json({ received: true, duplicate: !applied });
  });
  return router;
}
