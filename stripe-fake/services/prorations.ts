import type { Subscription } from '../types';
import { priceDetails, type LineDraft } from './invoicing';

/**
 * The two proration lines the service writes when the seat count changes mid-period:
 * a credit for the unused time on the old quantity and a charge for the remaining
 * time on the new one, each the full-period amount times the share of the period left
 * (time-based proration to the second, as the service documents under "Prorations").
 */
export function quantityProrationLines(
  subscription: Subscription,
  oldQuantity: number,
  newQuantity: number,
  at: number,
): LineDraft[] {
  const { current_period_start: start, current_period_end: end } = subscription;
  const { price } = subscription.items.data[0];
  const moment = Math.min(Math.max(at, start), end);
  const share = (end - moment) / (end - start);
  const since = new Date(moment * 1000).toISOString().slice(0, 10);
  const line = (quantity: number, sign: 1 | -1, wording: string): LineDraft => ({
    object: 'line_item',
    amount: sign * Math.round(price.unit_amount * quantity * share),
    currency: price.currency,
    description: `${wording} ${quantity} × seat after ${since}`,
    livemode: false,
    metadata: {},
    period: { start: moment, end },
    pricing: priceDetails(subscription),
    proration: true,
    quantity,
    subscription: subscription.id,
  });
  return [line(oldQuantity, -1, 'Unused time on'), line(newQuantity, 1, 'Remaining time on')];
}
