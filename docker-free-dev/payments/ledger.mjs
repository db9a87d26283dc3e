// @ts-check
// What the payments fake does, apart from HTTP: Checkout Sessions, paying one (which makes a
// succeeded PaymentIntent and its Charge, and a checkout.session.completed event), and Refunds.
// Objects use the processor's field names and id prefixes.
import { parseCheckoutSessionParams } from './checkout-params.mjs';
import {
  ApiError,
  formatMoney,
  integerParam,
  invalid,
  metadataParam,
  newId,
  noSuch,
  nowSeconds,
} from './objects.mjs';

export const DEFAULT_API_VERSION = '2026-10-28.endive';

/** Test card numbers: this one is declined, any other valid (Luhn) number pays. */
const DECLINED_CARD = '4000000000000002';

/** @param {string} digits */
function luhnValid(digits) {
  let sum = 0;
  for (let i = 0; i < digits.length; i++) {
    let d = Number(digits[digits.length - 1 - i]);
    if (i % 2 === 1) {
      d *= 2;
      if (d > 9) d -= 9;
    }
    sum += d;
  }
  return sum % 10 === 0;
}

/**
 * @param {{ store: import('./state.mjs').StateStore, baseUrl: () => string,
 *   webhooks: import('./webhooks.mjs').WebhookSender }} deps
 */
export function createLedger({ store, baseUrl, webhooks }) {
  const { state } = store;

  /** @param {string} id */
  function session(id) {
    const found = state.checkoutSessions[id];
    if (!found) throw noSuch('checkout.session', id);
    expireIfDue(found);
    return found;
  }

  /** @param {Record<string, any>} s */
  function expireIfDue(s) {
    if (s['status'] === 'open' && s['expires_at'] <= nowSeconds()) {
      s['status'] = 'expired';
      s['url'] = null;
      store.save();
    }
  }

  /** @param {string} sessionId */
  function lineItemList(sessionId) {
    return {
      object: 'list',
      data: state.lineItems[sessionId] ?? [],
      has_more: false,
      url: `/v1/checkout/sessions/${sessionId}/line_items`,
    };
  }

  /**
   * @param {Record<string, any>} params a parsed form body
   * @param {string} apiVersion
   */
  function createCheckoutSession(params, apiVersion) {
    const p = parseCheckoutSessionParams(params);
    const id = newId('cs_test', 58);
    const checkoutSession = {
      id,
      object: 'checkout.session',
      amount_subtotal: p.amount,
      amount_total: p.amount,
      cancel_url: p.cancelUrl,
      client_reference_id: p.clientReferenceId,
      created: p.created,
      currency: p.currency,
      customer: null,
      customer_details: null,
      customer_email: p.customerEmail,
      expires_at: p.expiresAt,
      livemode: false,
      locale: null,
      metadata: p.metadata,
      mode: 'payment',
      payment_intent: null,
      payment_method_types: ['card'],
      payment_status: 'unpaid',
      status: 'open',
      success_url: p.successUrl,
      total_details: { amount_discount: 0, amount_shipping: 0, amount_tax: 0 },
      ui_mode: 'hosted',
      url: `${baseUrl()}/pay/${id}`,
      // kept aside for the PaymentIntent made at payment time; never shown (see view())
      _intent: { ...p.intent, apiVersion },
    };
    state.checkoutSessions[id] = checkoutSession;
    state.lineItems[id] = p.items;
    store.save();
    return view(checkoutSession);
  }

  /**
   * Public view of a session (the fields the processor returns), with optional expansions.
   * @param {Record<string, any>} s
   * @param {string[]} [expand]
   */
  function view(s, expand = []) {
    const { _intent, ...rest } = s;
    /** @type {Record<string, any>} */
    const out = { ...rest };
    if (expand.includes('line_items')) out['line_items'] = lineItemList(s['id']);
    if (expand.includes('payment_intent') && s['payment_intent']) {
      out['payment_intent'] = state.paymentIntents[s['payment_intent']];
    }
    return out;
  }

  /**
   * Pays an open session with a test card. Declined and invalid cards throw an ApiError
   * whose message is fit to show on the pay page.
   * @param {string} sessionId
   * @param {{ cardNumber: string, email?: string, name?: string }} card
   */
  function pay(sessionId, { cardNumber, email, name }) {
    const s = session(sessionId);
    if (s['status'] === 'complete') return s;
    if (s['status'] !== 'open') {
      throw new ApiError(400, 'This payment page has expired.', {
        code: 'checkout_session_expired',
      });
    }
    const digits = cardNumber.replace(/[\s-]/g, '');
    if (!/^\d{12,19}$/.test(digits) || !luhnValid(digits)) {
      throw new ApiError(402, 'That card number is not valid. Check it and try again.', {
        type: 'card_error',
        code: 'incorrect_number',
      });
    }
    if (digits === DECLINED_CARD) {
      throw new ApiError(402, 'Your card was declined. Try another card.', {
        type: 'card_error',
        code: 'card_declined',
      });
    }
    const created = nowSeconds();
    const paymentIntentId = newId('pi', 24);
    const chargeId = newId('ch', 24);
    const receiptEmail = email || s['customer_email'] || null;
    state.charges[chargeId] = {
      id: chargeId,
      object: 'charge',
      amount: s['amount_total'],
      amount_captured: s['amount_total'],
      amount_refunded: 0,
      captured: true,
      created,
      currency: s['currency'],
      livemode: false,
      metadata: {},
      paid: true,
      payment_intent: paymentIntentId,
      payment_method: newId('pm', 24),
      payment_method_details: { type: 'card', card: { brand: 'visa', last4: digits.slice(-4) } },
      receipt_email: receiptEmail,
      refunded: false,
      status: 'succeeded',
    };
    state.paymentIntents[paymentIntentId] = {
      id: paymentIntentId,
      object: 'payment_intent',
      amount: s['amount_total'],
      amount_capturable: 0,
      amount_received: s['amount_total'],
      capture_method: 'automatic_async',
      client_secret: `${paymentIntentId}_secret_${newId('x', 24).slice(2)}`,
      confirmation_method: 'automatic',
      created,
      currency: s['currency'],
      customer: null,
      description: s['_intent']?.description ?? null,
      latest_charge: chargeId,
      livemode: false,
      metadata: s['_intent']?.metadata ?? {},
      payment_method: state.charges[chargeId]['payment_method'],
      payment_method_types: ['card'],
      receipt_email: receiptEmail,
      status: 'succeeded',
    };
    Object.assign(s, {
      status: 'complete',
      payment_status: 'paid',
      payment_intent: paymentIntentId,
      customer_details: {
        address: null,
        email: receiptEmail,
        name: name || null,
        phone: null,
        tax_exempt: 'none',
        tax_ids: [],
      },
      url: null,
    });
    const eventId = newId('evt', 24);
    state.events[eventId] = {
      id: eventId,
      object: 'event',
      api_version: s['_intent']?.apiVersion ?? DEFAULT_API_VERSION,
      created,
      data: { object: view(s) },
      livemode: false,
      pending_webhooks: 1,
      request: { id: null, idempotency_key: null },
      type: 'checkout.session.completed',
    };
    store.save();
    webhooks.send(eventId);
    return s;
  }

  /** @param {string} sessionId */
  function expire(sessionId) {
    const s = session(sessionId);
    if (s['status'] !== 'open') {
      throw new ApiError(400, `Only Checkout Sessions with a status of open can be expired.`, {
        code: 'checkout_session_not_open',
      });
    }
    s['status'] = 'expired';
    s['url'] = null;
    store.save();
    return view(s);
  }

  /** @param {Record<string, any>} params */
  function createRefund(params) {
    let charge;
    if (params['payment_intent']) {
      const intent = state.paymentIntents[params['payment_intent']];
      if (!intent) throw noSuch('payment_intent', params['payment_intent'], 'payment_intent');
      charge = state.charges[intent['latest_charge']];
    } else if (params['charge']) {
      charge = state.charges[params['charge']];
      if (!charge) throw noSuch('charge', params['charge'], 'charge');
    } else {
      throw new ApiError(
        400,
        'One of the following params should be provided for this request: payment_intent or charge.',
        {
          code: 'parameter_missing',
        },
      );
    }
    const remaining = charge['amount'] - charge['amount_refunded'];
    if (remaining <= 0) {
      throw new ApiError(400, `Charge ${charge['id']} has already been refunded.`, {
        code: 'charge_already_refunded',
      });
    }
    const amount =
      params['amount'] === undefined
        ? remaining
        : integerParam(params['amount'], 'amount', { min: 1 });
    if (amount > remaining) {
      throw new ApiError(
        400,
        `Refund amount (${formatMoney(amount, charge['currency'])}) is greater than unrefunded amount on charge (${formatMoney(remaining, charge['currency'])})`,
        { code: 'amount_too_large', param: 'amount' },
      );
    }
    const reasons = ['duplicate', 'fraudulent', 'requested_by_customer'];
    if (params['reason'] !== undefined && !reasons.includes(params['reason'])) {
      throw invalid('reason', `Invalid reason: must be one of ${reasons.join(', ')}`);
    }
    const id = newId('re', 24);
    const refund = {
      id,
      object: 'refund',
      amount,
      balance_transaction: null,
      charge: charge['id'],
      created: nowSeconds(),
      currency: charge['currency'],
      metadata: metadataParam(params['metadata']),
      payment_intent: charge['payment_intent'],
      reason: params['reason'] ?? null,
      receipt_number: null,
      status: 'succeeded',
    };
    state.refunds[id] = refund;
    charge['amount_refunded'] += amount;
    charge['refunded'] = charge['amount_refunded'] === charge['amount'];
    store.save();
    return refund;
  }

  return { session, view, lineItemList, createCheckoutSession, pay, expire, createRefund };
}

/** @typedef {ReturnType<typeof createLedger>} Ledger */
