// @ts-check
// Sign-in events streamed to the app: failed sign-ins and lock-outs happen here, never reach
// the app through the sign-in flow, and belong in each firm's audit log. Each event is one
// signed JSON POST, fire-and-forget: a slow or absent app never delays a sign-in page.
import { createHmac } from 'node:crypto';

/**
 * @typedef {{ type: 'sign-in-failed' | 'sign-in-locked', email: string,
 *   ipAddress: string | null, at: string }} ProviderEvent
 * @typedef {{ send(event: ProviderEvent): void, settle(): Promise<void> }} EventSender
 */

export const DEFAULT_EVENT_URL = 'http://127.0.0.1:4200/api/v1/auth/provider-events';

/**
 * `sha256=<hex>`: HMAC-SHA256 of the exact body bytes with the shared secret (what the app's
 * receiver recomputes over the raw body).
 * @param {string | Buffer} body
 * @param {string} secret
 */
export function signEvent(body, secret) {
  return `sha256=${createHmac('sha256', secret).update(body).digest('hex')}`;
}

/**
 * @param {{ url?: string, secret?: string, timeoutMs?: number,
 *   log?: (message: string) => void }} options  an empty url turns events off
 * @returns {EventSender}
 */
export function createEventSender({
  url,
  secret = '',
  timeoutMs = 2000,
  log = (message) => console.error(message),
}) {
  /** @type {Set<Promise<void>>} */
  const pending = new Set();
  if (url && !secret)
    log('identity-provider: IDP_EVENT_SECRET is empty; the app will refuse events');

  return {
    send(event) {
      if (!url) return;
      const body = JSON.stringify(event);
      const delivery = fetch(url, {
        method: 'POST',
        headers: { 'content-type': 'application/json', 'x-idp-signature': signEvent(body, secret) },
        body,
        signal: AbortSignal.timeout(timeoutMs),
      })
        .then(async (response) => {
          await response.body?.cancel();
          if (!response.ok)
            log(`identity-provider: the app refused a ${event.type} event (${response.status})`);
        })
        .catch((/** @type {Error} */ error) => {
          const reason = /** @type {any} */ (error).cause?.code ?? error.name;
          log(`identity-provider: could not deliver a ${event.type} event (${reason})`);
        })
        .finally(() => pending.delete(delivery));
      pending.add(delivery);
    },
    /** Waits for deliveries under way (each ends within the timeout): for a clean close. */
    async settle() {
      await Promise.all(pending);
    },
  };
}
