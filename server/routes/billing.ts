import express from 'express';
import { checkoutRequestSchema, resizeRequestSchema } from '../../shared/schemas/billing';
import type { AppContext } from '../context';
import { memberArea, publicArea, type ApiArea } from './route-table';

/** /api/billing/*: the seat plan, for admins. */
export function billingRoutes(ctx: AppContext): ApiArea {
  const { billing } = ctx;
  return memberArea('/billing', (route) => {
    route.get('/', 'manageSeats', {}, async ({ auth: { scope } }, res) => {
      res.json(await billing.summary(scope));
    });

    route.get('/plans', 'manageSeats', {}, async (_input, res) => {
      res.json({ plans: await billing.plans() });
    });

    route.post('/checkout', 'manageSeats', { body: checkoutRequestSchema }, async ({ auth: { user, scope }, body }, res) => {
      res.status(201).json({ url: await billing.startCheckout(scope, user, body) });
    });

    route.put('/seats', 'manageSeats', { body: resizeRequestSchema }, async ({ auth: { scope }, body }, res) => {
      res.json({ subscription: await billing.resize(scope, body.seats) });
    });

    route.post('/seats/preview', 'manageSeats', { body: resizeRequestSchema }, async ({ auth: { scope }, body }, res) => {
      res.json({ preview: await billing.previewResize(scope, body.seats) });
    });

    route.post('/cancel', 'manageSeats', {}, async ({ auth: { scope } }, res) => {
      res.json({ subscription: await billing.setCancelAtPeriodEnd(scope, true) });
    });

    route.post('/resume', 'manageSeats', {}, async ({ auth: { scope } }, res) => {
      res.json({ subscription: await billing.setCancelAtPeriodEnd(scope, false) });
    });

    route.get('/invoices', 'manageSeats', {}, async ({ auth: { scope } }, res) => {
      res.json({ invoices: await billing.invoices(scope) });
    });
  });
}

/**
 * POST /api/billing/webhook: events from the payment service, trusted by their signature. Mounted
 * before the JSON parser because the signature covers the exact bytes received.
 */
export function billingWebhookRoutes(ctx: AppContext): ApiArea {
  return publicArea('/billing/webhook', (route) => {
    route.post('/', { before: [express.raw({ type: '*/*', limit: '256kb' })] }, async ({ req }, res) => {
      const body = Buffer.isBuffer(req.body) ? req.body : Buffer.alloc(0);
      const event = ctx.webhooks.verify(body, req.get('stripe-signature'));
      const applied = await ctx.webhooks.receive(event);
      res.json({ received: true, duplicate: !applied });
    });
  }, { rawBody: true });
}
