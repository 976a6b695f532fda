import type { FakeContext } from '../context';
import { newId } from '../ids';
import type { EventType, StripeEvent } from '../types';

/** The top-level fields of `before` whose values differ in `after`, with their old values. */
export function previousAttributes(before: object, after: object): Record<string, unknown> {
  const previous: Record<string, unknown> = {};
  const old = before as Record<string, unknown>;
  const now = after as Record<string, unknown>;
  for (const key of Object.keys(old)) {
    if (JSON.stringify(old[key]) !== JSON.stringify(now[key])) previous[key] = old[key];
  }
  return previous;
}

/** Records an event with a snapshot of `object` and hands it to the webhook sender. */
export function emitEvent(
  ctx: FakeContext,
  type: EventType,
  object: object,
  previous?: Record<string, unknown>,
): StripeEvent {
  const event: StripeEvent = {
    id: newId('evt'),
    object: 'event',
    api_version: ctx.apiVersion,
    created: ctx.clock.now(),
    data: { object: structuredClone(object), ...(previous ? { previous_attributes: previous } : {}) },
    livemode: false,
    pending_webhooks: 0,
    request: { id: null, idempotency_key: null },
    type,
  };
  ctx.state.events.add(event);
  ctx.webhooks.send(event);
  return event;
}
