import type { FakeClock } from './clock';
import { newId } from './ids';
import type { FakeStripeState } from './store';
import type { Interval, Price } from './types';

/** The seat plan the fake sells. Demo figures, invented for the product. */
export const SEAT_PLAN = {
  productName: 'Tarnish seat',
  productDescription: 'One paid member (admin, consultant or scientist) of an organisation',
  currency: 'eur',
  prices: [
    { lookupKey: 'seat_monthly', nickname: 'Seat, monthly', interval: 'month', unitAmount: 3900 },
    { lookupKey: 'seat_yearly', nickname: 'Seat, yearly', interval: 'year', unitAmount: 39000 },
  ] satisfies { lookupKey: string; nickname: string; interval: Interval; unitAmount: number }[],
} as const;

/** Creates the seat product and its prices, as at the start of every run and after a reset. */
export function seedCatalog(state: FakeStripeState, clock: FakeClock): void {
  const created = clock.now();
  const productId = newId('prod');
  const prices: Price[] = SEAT_PLAN.prices.map((plan) => ({
    id: newId('price'),
    object: 'price',
    active: true,
    billing_scheme: 'per_unit',
    created,
    currency: SEAT_PLAN.currency,
    livemode: false,
    lookup_key: plan.lookupKey,
    metadata: {},
    nickname: plan.nickname,
    product: productId,
    recurring: { interval: plan.interval, interval_count: 1, usage_type: 'licensed', meter: null },
    tax_behavior: 'unspecified',
    type: 'recurring',
    unit_amount: plan.unitAmount,
    unit_amount_decimal: String(plan.unitAmount),
  }));
  state.products.add({
    id: productId,
    object: 'product',
    active: true,
    created,
    default_price: prices[0].id,
    description: SEAT_PLAN.productDescription,
    livemode: false,
    metadata: {},
    name: SEAT_PLAN.productName,
    type: 'service',
    unit_label: 'seat',
    updated: created,
  });
  for (const price of prices) state.prices.add(price);
}
