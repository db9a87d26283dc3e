// @ts-check
// Sends events to the configured webhook URL, signed like the card processor does it
// (`Stripe-Signature: t=<unix time>,v1=<hex HMAC-SHA256 of "<t>.<raw body>" keyed by the
// whole webhook secret>`), so `stripe.webhooks.constructEvent` accepts them. Failed deliveries
// are retried with growing delays; the delivery state is part of the persisted state, so
// undelivered events are sent again after a restart.
import { createHmac } from 'node:crypto';

/**
 * @param {string} payload the exact body sent
 * @param {string} secret e.g. whsec_…
 * @param {number} [timestamp] unix seconds
 */
export function signatureHeader(payload, secret, timestamp = Math.floor(Date.now() / 1000)) {
  const signature = createHmac('sha256', secret)
    .update(`${timestamp}.${payload}`, 'utf8')
    .digest('hex');
  return `t=${timestamp},v1=${signature}`;
}

/** Delays before the 2nd, 3rd, … attempt. */
export const DEFAULT_RETRY_DELAYS_MS = [
  1_000, 2_000, 5_000, 15_000, 30_000, 60_000, 120_000, 300_000,
];

/**
 * @param {{
 *   url: string,
 *   secret: string,
 *   retryDelaysMs?: number[],
 *   store: import('./state.mjs').StateStore,
 * }} options
 */
export function createWebhookSender({
  url,
  secret,
  retryDelaysMs = DEFAULT_RETRY_DELAYS_MS,
  store,
}) {
  const { state } = store;
  /** @type {Map<string, NodeJS.Timeout>} */
  const timers = new Map();
  /** @type {Set<Promise<void>>} */
  const inFlight = new Set();
  let closed = false;

  /** @param {string} eventId @param {number} delay */
  function schedule(eventId, delay) {
    if (closed || timers.has(eventId)) return;
    const timer = setTimeout(() => {
      timers.delete(eventId);
      const run = attempt(eventId).finally(() => inFlight.delete(run));
      inFlight.add(run);
    }, delay);
    timers.set(eventId, timer);
  }

  /** @param {string} eventId */
  async function attempt(eventId) {
    const event = state.events[eventId];
    const delivery = state.deliveries[eventId];
    if (!event || !delivery || delivery.status !== 'pending') return;
    const payload = JSON.stringify(event, null, 2);
    delivery.attempts += 1;
    try {
      const response = await fetch(url, {
        method: 'POST',
        headers: {
          'Content-Type': 'application/json; charset=utf-8',
          'Stripe-Signature': signatureHeader(payload, secret),
          'User-Agent': 'Latchwork-Payments-Fake/1.0 (webhooks)',
        },
        body: payload,
        signal: AbortSignal.timeout(10_000),
        redirect: 'manual',
      });
      await response.arrayBuffer().catch(() => undefined);
      delivery.lastResponseStatus = response.status;
      if (response.status >= 200 && response.status < 300) {
        delivery.status = 'delivered';
        delivery.deliveredAt = Math.floor(Date.now() / 1000);
        delivery.lastError = null;
      } else {
        delivery.lastError = `HTTP ${response.status}`;
      }
    } catch (error) {
      delivery.lastResponseStatus = null;
      delivery.lastError = /** @type {Error} */ (error).message;
    }
    if (delivery.status === 'pending') {
      const delay = retryDelaysMs[delivery.attempts - 1];
      if (delay === undefined) {
        delivery.status = 'failed';
        console.error(
          `payments: gave up delivering ${event['type']} ${eventId} to ${url} after ${delivery.attempts} attempts (${delivery.lastError})`,
        );
      } else {
        schedule(eventId, delay);
      }
    }
    store.save();
  }

  return {
    url,
    /** Queues a stored event for delivery now. @param {string} eventId */
    send(eventId) {
      state.deliveries[eventId] ??= {
        attempts: 0,
        status: 'pending',
        lastError: null,
        lastResponseStatus: null,
        deliveredAt: null,
      };
      store.save();
      schedule(eventId, 0);
    },
    /** Picks up deliveries left pending by the previous run. */
    resume() {
      for (const [eventId, delivery] of Object.entries(state.deliveries)) {
        if (delivery.status === 'pending') schedule(eventId, 250);
      }
    },
    async close() {
      closed = true;
      for (const timer of timers.values()) clearTimeout(timer);
      timers.clear();
      await Promise.allSettled([...inFlight]);
    },
  };
}

/** @typedef {ReturnType<typeof createWebhookSender>} WebhookSender */
