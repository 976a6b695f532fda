import express, { Router } from 'express';
import { z } from 'zod';
import type { FakeStripeControls } from '../controls';
import { parseParams } from '../params';

const completeParams = z.strictObject({
  card_number: z.string(),
  email: z.string().optional(),
  name: z.string().optional(),
});
const advanceParams = z
  .strictObject({ seconds: z.coerce.number().int().min(0).optional(), days: z.coerce.number().min(0).optional() })
  .refine((value) => value.seconds !== undefined || value.days !== undefined, { message: 'give seconds or days', path: ['seconds'] });
const failParams = z.strictObject({ customer: z.string().optional() });
const webhookParams = z.strictObject({ url: z.url().nullable() });

/**
 * The control API under `/_fake`, a path the service's API never uses. No API key:
 * the fake listens on loopback only, and these calls stand in for a person at a
 * browser or for time passing.
 */
export function controlRoutes(controls: FakeStripeControls): Router {
  const router = Router();
  router.use('/_fake', express.json(), express.urlencoded({ extended: true }));

  router.get('/_fake/health', (_req, res) => {
    res.json({ ok: true, now: controls.now(), webhook_url: controls.webhookUrl() });
  });

  router.post('/_fake/checkout/sessions/:id/complete', (req, res) => {
    const params = parseParams(completeParams, req.body);
    const result = controls.completeCheckout(req.params.id, {
      cardNumber: params.card_number,
      email: params.email,
      name: params.name,
    });
    res.json(result);
  });

  router.post('/_fake/clock/advance', (req, res) => {
    const { seconds = 0, days = 0 } = parseParams(advanceParams, req.body);
    res.json(controls.advanceClock(seconds + Math.round(days * 86_400)));
  });

  router.post('/_fake/subscriptions/:id/renew', (req, res) => {
    res.json(controls.renewSubscription(req.params.id));
  });

  router.post('/_fake/charges/fail-next', (req, res) => {
    const { customer } = parseParams(failParams, req.body);
    controls.failNextCharge(customer);
    res.json({ failing: customer ?? '*' });
  });

  router.post('/_fake/invoices/:id/retry', (req, res) => {
    res.json(controls.retryInvoice(req.params.id));
  });

  router.get('/_fake/events', (_req, res) => {
    res.json({ data: controls.events() });
  });

  router.get('/_fake/deliveries', async (req, res) => {
    // `?settled=true` answers once every delivery has succeeded or used up its attempts.
    if (req.query.settled === 'true') await controls.whenWebhooksIdle();
    res.json({ data: controls.deliveries() });
  });

  router.get('/_fake/webhook', (_req, res) => {
    res.json({ url: controls.webhookUrl() });
  });

  router.put('/_fake/webhook', (req, res) => {
    const { url } = parseParams(webhookParams, req.body);
    controls.setWebhookUrl(url);
    res.json({ url });
  });

  router.post('/_fake/reset', (_req, res) => {
    controls.reset();
    res.json({ ok: true, now: controls.now() });
  });

  return router;
}
