import type { EventType, StripeEvent } from '../types';
import { signPayload } from './sign';

export interface WebhookSenderOptions {
  url: string | null;
  secret: string;
  /** Delay before the first retry; each later retry waits twice as long. */
  retryBaseMs: number;
  /** Attempts per event, the first included. */
  maxAttempts: number;
  /** How long one attempt may take before it counts as failed. */
  timeoutMs?: number;
}

export interface DeliveryAttempt {
  event: string;
  type: EventType;
  attempt: number;
  url: string;
  at: string;
  /** HTTP status of the receiver's answer; null when it could not be reached. */
  status: number | null;
  error: string | null;
  ok: boolean;
}

export interface WebhookSender {
  send(event: StripeEvent): void;
  attempts(): DeliveryAttempt[];
  url(): string | null;
  setUrl(url: string | null): void;
  /** Resolves once every event has been delivered or has used up its attempts. */
  whenIdle(): Promise<void>;
  /** Forgets the log and drops retries still waiting. */
  reset(): void;
}

/** Exponential back-off: the base delay after the first failed attempt, doubling after each further one. */
export function retryDelayMs(baseMs: number, failedAttempt: number): number {
  return baseMs * 2 ** (failedAttempt - 1);
}

export function createWebhookSender(options: WebhookSenderOptions): WebhookSender {
  let targetUrl = options.url;
  let log: DeliveryAttempt[] = [];
  let generation = 0;
  let inFlight = 0;
  let idleWaiters: (() => void)[] = [];
  // First attempts go out one after another, in the order the events happened.
  let firstAttempts: Promise<void> = Promise.resolve();

  const settle = () => {
    inFlight -= 1;
    if (inFlight > 0) return;
    for (const resolve of idleWaiters) resolve();
    idleWaiters = [];
  };

  async function post(url: string, payload: string): Promise<{ status: number | null; error: string | null }> {
    try {
      const response = await fetch(url, {
        method: 'POST',
        headers: {
          'Content-Type': 'application/json; charset=utf-8',
          'Stripe-Signature': signPayload(payload, options.secret),
          'User-Agent': 'Stripe/1.0 (+https://stripe.com/docs/webhooks)',
        },
        body: payload,
        signal: AbortSignal.timeout(options.timeoutMs ?? 10_000),
      });
      await response.arrayBuffer();
      return { status: response.status, error: response.ok ? null : `receiver answered ${response.status}` };
    } catch (error) {
      const cause = (error as { cause?: { code?: string } }).cause?.code;
      return { status: null, error: cause ?? (error as Error).message };
    }
  }

  async function attempt(event: StripeEvent, number: number, runGeneration: number): Promise<void> {
    if (runGeneration !== generation) return;
    const url = targetUrl;
    if (!url) return settle();
    const payload = JSON.stringify(event, null, 2);
    const result = await post(url, payload);
    if (runGeneration !== generation) return;
    const ok = result.error === null;
    log.push({ event: event.id, type: event.type, attempt: number, url, at: new Date().toISOString(), ...result, ok });
    if (ok) {
      event.pending_webhooks = 0;
      return settle();
    }
    if (number >= options.maxAttempts) return settle();
    setTimeout(() => void attempt(event, number + 1, runGeneration), retryDelayMs(options.retryBaseMs, number)).unref();
  }

  return {
    send(event) {
      if (!targetUrl) return;
      inFlight += 1;
      event.pending_webhooks = 1;
      const runGeneration = generation;
      firstAttempts = firstAttempts
        .then(() => attempt(event, 1, runGeneration))
        .catch((error: unknown) => {
          // Keep the queue moving for later events; this one is given up.
          console.error('[stripe-fake] webhook delivery failed', error);
          settle();
        });
    },
    attempts: () => [...log],
    url: () => targetUrl,
    setUrl(url) {
      targetUrl = url;
    },
    whenIdle() {
      if (inFlight === 0) return Promise.resolve();
      return new Promise((resolve) => idleWaiters.push(resolve));
    },
    reset() {
      generation += 1;
      log = [];
      inFlight = 0;
      for (const resolve of idleWaiters) resolve();
      idleWaiters = [];
    },
  };
}
