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

/**
 * The local fake keeps nothing between starts: every running plan in our table that the
 * fake does not know (the seeded demo plan, or one bought before a restart) is bought
 * again there with the same seats, and its webhooks bring our table in step.
 */
export async function replayPlansInFake(ctx: AppContext, fake: RunningFakeStripe): Promise<number> {
  const rows = await ctx.db('subscriptions').whereNot({ status: 'canceled' }).select('organisation_id', 'subscription_ref', 'seats');
  let bought = 0;
  for (const row of rows) {
    if (await knownToFake(ctx, row.subscription_ref)) continue;
    const admin = await ctx.db('users').where({ organisation_id: row.organisation_id, role: 'admin', status: 'active' }).first('email');
    if (!admin) continue;
    await buyPlanInFake(ctx, fake, row.organisation_id, admin.email, row.seats);
    bought += 1;
  }
  return bought;
}

async function knownToFake(ctx: AppContext, subscriptionRef: string): Promise<boolean> {
  try {
    await ctx.payments.subscriptions.retrieve(subscriptionRef);
    return true;
  } catch {
    return false;
  }
}
