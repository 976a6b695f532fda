import { formatMoney } from '../services/invoicing';
import type { CheckoutSession, Price, Product, SessionOrder } from '../types';
import { html, page } from './html';
import { WORDING } from './wording';

export interface CheckoutPageInput {
  session: CheckoutSession;
  order: SessionOrder;
  price: Price;
  product: Product;
  /** Whether the payer must give an e-mail (no customer and no customer_email on the session). */
  asksEmail: boolean;
  error?: string;
  /** What the payer typed, shown again after an error (never the card number). */
  entered?: { email?: string; name?: string; expiry?: string };
}

/** The hosted card form at a session's `url`: a plain HTML form that posts back to itself. */
export function renderCheckoutPage(input: CheckoutPageInput): string {
  const { session, order, price, product, entered = {} } = input;
  const per = price.recurring.interval === 'year' ? 'year' : 'month';
  const total = formatMoney(session.amount_total, session.currency);
  const body = html`
    <span class="mode">${WORDING.testMode}</span>
    <h1>${WORDING.checkoutTitle}</h1>
    <p class="muted">${session.customer_email ?? ''}</p>
    <table>
      <tr><td>${product.name} × ${order.quantity}</td>
          <td class="amount">${formatMoney(price.unit_amount, price.currency)} / seat / ${per}</td></tr>
      <tr class="total"><td>${WORDING.total} (${per}ly)</td><td class="amount" data-total>${total}</td></tr>
    </table>
    ${input.error ? html`<p class="error" role="alert">${input.error}</p>` : ''}
    <form method="post" action="/hosted/checkout/${session.id}">
      ${input.asksEmail
        ? html`<label for="email">${WORDING.email}</label>
               <input id="email" name="email" type="email" required autocomplete="email" value="${entered.email ?? ''}">`
        : ''}
      <label for="card_number">${WORDING.cardNumber}</label>
      <input id="card_number" name="card_number" inputmode="numeric" autocomplete="cc-number" required placeholder="4242 4242 4242 4242">
      <div class="row">
        <div><label for="expiry">${WORDING.expiry}</label>
          <input id="expiry" name="expiry" autocomplete="cc-exp" required placeholder="12 / 34" value="${entered.expiry ?? ''}"></div>
        <div><label for="cvc">${WORDING.cvc}</label>
          <input id="cvc" name="cvc" inputmode="numeric" autocomplete="cc-csc" required placeholder="123"></div>
      </div>
      <label for="name">${WORDING.cardName}</label>
      <input id="name" name="name" autocomplete="cc-name" value="${entered.name ?? ''}">
      <button type="submit">${WORDING.pay(total)}</button>
    </form>
    ${session.cancel_url ? html`<p class="note"><a href="${session.cancel_url}">${WORDING.cancel}</a></p>` : ''}
    <p class="note">${WORDING.testCards}</p>`;
  return page(WORDING.checkoutTitle, body);
}

export function renderClosedPage(): string {
  return page(WORDING.sessionClosed, html`<span class="mode">${WORDING.testMode}</span><h1>${WORDING.sessionClosed}</h1>`);
}
