import { PDFParse } from 'pdf-parse';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { startHarness, subscribedCustomer, type Harness } from './testing/fake-stripe-harness';

let harness: Harness;
beforeEach(async () => {
  harness = await startHarness();
});
afterEach(() => harness.close());

describe('invoice links', () => {
  it('serves the hosted invoice page with its lines and totals', async () => {
    const { subscriptionId } = await subscribedCustomer(harness, 2);
    const [invoice] = (await harness.stripe.invoices.list({ subscription: subscriptionId })).data;
    const page = await fetch(invoice.hosted_invoice_url!);
    expect(page.status).toBe(200);
    expect(page.headers.get('content-type')).toContain('text/html');
    const markup = await page.text();
    expect(markup).toContain(`Invoice ${invoice.number}`);
    expect(markup).toContain('2 × seat (at 39.00 EUR / month)');
    expect(markup).toContain('78.00 EUR');
    expect(markup).toContain('Paid');
    expect(markup).toContain(`href="${invoice.invoice_pdf}"`);
  });

  it('serves a real PDF of the invoice', async () => {
    const { subscriptionId } = await subscribedCustomer(harness, 2);
    const [invoice] = (await harness.stripe.invoices.list({ subscription: subscriptionId })).data;
    expect(invoice.number).toMatch(/^[0-9A-Z]{8}-0001$/);
    const response = await fetch(invoice.invoice_pdf!);
    expect(response.status).toBe(200);
    expect(response.headers.get('content-type')).toBe('application/pdf');
    const bytes = Buffer.from(await response.arrayBuffer());
    expect(bytes.subarray(0, 5).toString()).toBe('%PDF-');
    const parser = new PDFParse({ data: bytes });
    const { text, total } = await parser.getText();
    await parser.destroy();
    expect(total).toBe(1);
    expect(text).toContain(`Invoice ${invoice.number}`);
    expect(text).toContain('Total: 78.00 EUR');
    expect(text).toContain('Amount paid: 78.00 EUR');
  });

  it('answers an unknown invoice link with 404', async () => {
    const response = await fetch(`${harness.fake.url}/hosted/invoices/in_missing/pdf`);
    expect(response.status).toBe(404);
  });
});
