import { formatMoney } from '../services/invoicing';
import type { Invoice } from '../types';
import { html, page } from './html';
import { WORDING } from './wording';

const day = (unix: number) => new Date(unix * 1000).toISOString().slice(0, 10);

/** The invoice's `hosted_invoice_url`: lines, totals, status and the PDF link. */
export function renderInvoicePage(invoice: Invoice): string {
  const money = (amount: number) => formatMoney(amount, invoice.currency);
  const credit = invoice.starting_balance < 0 ? Math.min(invoice.total, -invoice.starting_balance) : 0;
  const body = html`
    <span class="mode">${WORDING.testMode}</span>
    <h1>${WORDING.invoiceTitle(invoice.number)}</h1>
    <p class="muted">${invoice.customer_email ?? ''} · ${day(invoice.created)} ·
      <strong>${invoice.status === 'paid' ? WORDING.invoicePaid : WORDING.invoiceOpen}</strong></p>
    <table>
      ${invoice.lines.data.map(
        (line) => html`<tr><td>${line.description}<br><span class="muted">${day(line.period.start)} – ${day(line.period.end)}</span></td>
          <td class="amount">${money(line.amount)}</td></tr>`,
      )}
      <tr class="total"><td>${WORDING.total}</td><td class="amount">${money(invoice.total)}</td></tr>
      ${credit > 0 ? html`<tr><td>${WORDING.creditUsed}</td><td class="amount">${money(-credit)}</td></tr>` : ''}
      <tr><td>${WORDING.amountDue}</td><td class="amount">${money(invoice.amount_due)}</td></tr>
      <tr><td>${WORDING.amountPaid}</td><td class="amount">${money(invoice.amount_paid)}</td></tr>
    </table>
    <p><a href="${invoice.invoice_pdf}">${WORDING.downloadPdf}</a></p>`;
  return page(WORDING.invoiceTitle(invoice.number), body);
}
