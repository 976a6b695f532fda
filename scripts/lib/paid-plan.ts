import type { RunningFakeStripe } from '../../stripe-fake';
import type { AppContext } from '../../server/context';

/** The fake's card that is always accepted (stripe-fake/README.md, "Test cards"). */
export const ACCEPTED_CARD = '4242 4242 4242 4242';

/**
 * Buys `seats` monthly seats for an organisation in the local fake, paying the checkout
 * without a browser, and waits until the app has received the resulting webhooks.
 */
export async function buyPlanInFake(
  ctx: AppContext,
  fake: RunningFakeStripe,
  organisationId: number,
  payerEmail: string,
  seats: number,
): Promise<string> {
  const session = await ctx.billing.openCheckout(organisationId, { email: payerEmail }, { seats, interval: 'monthly' });
  const { subscription } = fake.controls.completeCheckout(session.id, { cardNumber: ACCEPTED_CARD });
  await fake.controls.whenWebhooksIdle();
  return subscription.id;
}
