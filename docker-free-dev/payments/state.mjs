// @ts-check
// The payments fake's state: plain objects in the processor's shapes, kept in memory and
// written to <dataDir>/payments/state.json after every change (atomically), so a restart or a
// Ctrl-C of the demo loses no session, payment, refund or undelivered webhook.
import { mkdirSync, readFileSync, renameSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';

/**
 * @typedef {Record<string, any>} ApiObject
 * @typedef {{ attempts: number, status: 'pending' | 'delivered' | 'failed',
 *   lastError: string | null, lastResponseStatus: number | null, deliveredAt: number | null }} Delivery
 * @typedef {{ fingerprint: string, status: number, body: unknown, createdAt: number }} IdempotentResult
 * @typedef {object} PaymentsState
 * @property {Record<string, ApiObject>} checkoutSessions
 * @property {Record<string, ApiObject[]>} lineItems by checkout session id
 * @property {Record<string, ApiObject>} paymentIntents
 * @property {Record<string, ApiObject>} charges
 * @property {Record<string, ApiObject>} refunds
 * @property {Record<string, ApiObject>} events
 * @property {Record<string, Delivery>} deliveries by event id
 * @property {Record<string, IdempotentResult>} idempotency by `<api key>:<idempotency key>`
 */

/** @returns {PaymentsState} */
function empty() {
  return {
    checkoutSessions: {},
    lineItems: {},
    paymentIntents: {},
    charges: {},
    refunds: {},
    events: {},
    deliveries: {},
    idempotency: {},
  };
}

const IDEMPOTENCY_TTL_MS = 24 * 60 * 60 * 1000;

/** @param {string} dir <dataDir>/payments */
export function openState(dir) {
  const file = join(dir, 'state.json');
  /** @type {PaymentsState} */
  let state = empty();
  try {
    state = { ...empty(), ...JSON.parse(readFileSync(file, 'utf8')) };
  } catch {
    // first start
  }

  return {
    state,
    save() {
      const cutoff = Date.now() - IDEMPOTENCY_TTL_MS;
      for (const [key, result] of Object.entries(state.idempotency)) {
        if (result.createdAt < cutoff) delete state.idempotency[key];
      }
      mkdirSync(dir, { recursive: true });
      const temp = `${file}.tmp`;
      writeFileSync(temp, JSON.stringify(state, null, 1));
      renameSync(temp, file);
    },
  };
}

/** @typedef {ReturnType<typeof openState>} StateStore */
