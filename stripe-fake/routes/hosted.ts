import express, { Router, type Response } from 'express';
import type { FakeContext } from '../context';
import { FakeStripeError } from '../errors';
import { renderCheckoutPage, renderClosedPage, type CheckoutPageInput } from '../pages/checkout-page';
import { renderInvoicePage } from '../pages/invoice-page';
import { renderInvoicePdf } from '../pages/invoice-pdf';
import { WORDING } from '../pages/wording';
import { completeSession, openSession } from '../services/checkout';

// Inline styles only; no scripts or outside assets on these pages.
const PAGE_POLICY = "default-src 'none'; style-src 'unsafe-inline'; img-src data:";

function isFutureExpiry(text: string): boolean {
  const match = /^\s*(\d{1,2})\s*\/\s*(\d{2})\s*$/.exec(text);
  if (!match) return false;
  const month = Number(match[1]);
  const year = 2000 + Number(match[2]);
  const today = new Date();
  return month >= 1 && month <= 12 && year * 12 + month >= today.getUTCFullYear() * 12 + today.getUTCMonth() + 1;
}

function sendPage(res: Response, status: number, markup: string): void {
  res.status(status).set('Content-Security-Policy', PAGE_POLICY).type('html').send(markup);
}

/** What the payer's browser sees: the checkout form and the invoice page and PDF. */
export function hostedRoutes(ctx: FakeContext): Router {
  const router = Router();

  const pageInput = (sessionId: string): Omit<CheckoutPageInput, 'error' | 'entered'> | null => {
    try {
      const session = openSession(ctx, sessionId);
      const order = ctx.state.sessionOrders.get(session.id)!;
      const price = ctx.state.prices.find(order.price);
      const product = ctx.state.products.find(price.product);
      return { session, order, price, product, asksEmail: !session.customer && !session.customer_email };
    } catch (error) {
      if (error instanceof FakeStripeError) return null;
      throw error;
    }
  };

  router.get('/hosted/checkout/:id', (req, res) => {
    const input = pageInput(req.params.id);
    if (!input) return sendPage(res, 410, renderClosedPage());
    sendPage(res, 200, renderCheckoutPage(input));
  });

  router.post('/hosted/checkout/:id', express.urlencoded({ extended: false }), (req, res) => {
    const input = pageInput(req.params.id);
    if (!input) return sendPage(res, 410, renderClosedPage());
    const form = (req.body ?? {}) as Record<string, string | undefined>;
    const entered = { email: form.email, name: form.name, expiry: form.expiry };
    const showError = (status: number, error: string) => sendPage(res, status, renderCheckoutPage({ ...input, error, entered }));
    if (!isFutureExpiry(form.expiry ?? '')) return showError(400, WORDING.badExpiry);
    if (!/^\d{3,4}$/.test((form.cvc ?? '').trim())) return showError(400, WORDING.badCvc);
    try {
      const { session } = completeSession(ctx, req.params.id, {
        cardNumber: form.card_number ?? '',
        email: form.email,
        name: form.name,
      });
      res.redirect(303, session.success_url.replaceAll('{CHECKOUT_SESSION_ID}', session.id));
    } catch (error) {
      if (!(error instanceof FakeStripeError)) throw error;
      showError(error.status, error.status === 402 ? WORDING.declined(error.body.message) : error.body.message);
    }
  });

  router.get('/hosted/invoices/:id', (req, res) => {
    sendPage(res, 200, renderInvoicePage(ctx.state.invoices.find(req.params.id)));
  });

  router.get('/hosted/invoices/:id/pdf', async (req, res) => {
    const invoice = ctx.state.invoices.find(req.params.id);
    const pdf = await renderInvoicePdf(invoice);
    res.type('application/pdf').set('Content-Disposition', `inline; filename="invoice-${invoice.number}.pdf"`).send(pdf);
  });

  return router;
}
