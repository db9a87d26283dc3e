// The payments fake through the official `stripe` SDK pointed at it with host/port/protocol:
// Checkout Session create/retrieve, paying on the hosted page, the signed webhook (verified with
// the SDK's constructEvent on the raw body, after a failed first delivery), PaymentIntent
// retrieve, partial/full/over-refunds, idempotency keys, auth errors, and a restart.
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import Stripe from 'stripe';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { start } from '../../docker-free-dev/payments/server.mjs';
import { foreignUrls, tempDataDir } from './support';

type Payments = Awaited<ReturnType<typeof start>>;
const SECRET_KEY = 'sk_test_fakes_suite';
const WEBHOOK_SECRET = 'whsec_fakes_suite';
const SUCCESS_URL = 'http://127.0.0.1:4299/invoices/INV-0042/paid?session={CHECKOUT_SESSION_ID}';
const CANCEL_URL = 'http://127.0.0.1:4299/invoices/INV-0042';

interface Received {
  raw: Buffer;
  signature: string;
}

let data: Awaited<ReturnType<typeof tempDataDir>>;
let payments: Payments;
let stripe: Stripe;
let hookServer: http.Server;
const received: Received[] = [];
let failNextDeliveries = 1;

function sdk(key: string, port: number) {
  return new Stripe(key, { host: '127.0.0.1', port, protocol: 'http', maxNetworkRetries: 0 });
}

async function startPayments() {
  const port = (hookServer.address() as AddressInfo).port;
  return start({
    port: 0,
    dataDir: data.dir,
    secretKey: SECRET_KEY,
    webhookSecret: WEBHOOK_SECRET,
    webhookUrl: `http://127.0.0.1:${port}/api/v1/payments/webhook`,
    webhookRetryDelaysMs: [50, 100, 200],
  });
}

async function waitFor<T>(probe: () => T | undefined, ms = 5000): Promise<T> {
  const until = Date.now() + ms;
  for (;;) {
    const value = probe();
    if (value !== undefined) return value;
    if (Date.now() > until) throw new Error('timed out waiting');
    await new Promise((resolve) => setTimeout(resolve, 20));
  }
}

function newSession(extra: Partial<Stripe.Checkout.SessionCreateParams> = {}) {
  return stripe.checkout.sessions.create({
    mode: 'payment',
    customer_email: 'dana@quillgarages.test',
    success_url: SUCCESS_URL,
    cancel_url: CANCEL_URL,
    metadata: { tenant_id: 't-harbour', invoice_id: 'INV-0042' },
    line_items: [
      {
        quantity: 3,
        price_data: {
          currency: 'gbp',
          unit_amount: 4250,
          product_data: { name: 'Deposit: garage floor, stage 1' },
        },
      },
      {
        quantity: 1,
        price_data: { currency: 'gbp', unit_amount: 1999, product_data: { name: 'Edge ramps' } },
      },
    ],
    ...extra,
  });
}

function payOnPage(url: string, cardNumber: string) {
  return fetch(url, {
    method: 'POST',
    body: new URLSearchParams({ card_number: cardNumber, email: 'dana@quillgarages.test' }),
    redirect: 'manual',
  });
}

beforeAll(async () => {
  data = await tempDataDir('payments');
  // The app's webhook endpoint, as the API will have it: raw body kept for verification.
  hookServer = http.createServer((req, res) => {
    const chunks: Buffer[] = [];
    req.on('data', (chunk: Buffer) => chunks.push(chunk));
    req.on('end', () => {
      if (failNextDeliveries > 0) {
        failNextDeliveries -= 1;
        res.writeHead(500).end('not now');
        return;
      }
      received.push({
        raw: Buffer.concat(chunks),
        signature: String(req.headers['stripe-signature']),
      });
      res.writeHead(200, { 'content-type': 'application/json' }).end('{"received":true}');
    });
  });
  await new Promise<void>((resolve) => hookServer.listen(0, '127.0.0.1', resolve));
  payments = await startPayments();
  stripe = sdk(SECRET_KEY, payments.port);
});

afterAll(async () => {
  await payments?.close();
  await new Promise((resolve) => hookServer?.close(resolve));
  await data?.remove();
});

describe('payments fake', () => {
  let sessionId = '';
  let paymentIntentId = '';

  it('answers its health check', async () => {
    expect(payments.url).toMatch(/^http:\/\/127\.0\.0\.1:\d+$/);
    expect((await fetch(`${payments.url}/health`)).status).toBe(200);
  });

  it('refuses a missing or wrong secret key with the processor error shape', async () => {
    await expect(
      sdk('sk_test_wrong_key', payments.port).checkout.sessions.retrieve('cs_test_x'),
    ).rejects.toMatchObject({
      type: 'StripeAuthenticationError',
      statusCode: 401,
    });
    const response = await fetch(`${payments.url}/v1/payment_intents/pi_x`);
    expect(response.status).toBe(401);
    expect(await response.json()).toMatchObject({ error: { type: 'invalid_request_error' } });
  });

  it('creates a Checkout Session from form-encoded nested params', async () => {
    const session = await newSession();
    sessionId = session.id;
    expect(session.id).toMatch(/^cs_test_/);
    expect(session).toMatchObject({
      object: 'checkout.session',
      mode: 'payment',
      status: 'open',
      payment_status: 'unpaid',
      amount_total: 3 * 4250 + 1999,
      currency: 'gbp',
      customer_email: 'dana@quillgarages.test',
      metadata: { tenant_id: 't-harbour', invoice_id: 'INV-0042' },
      success_url: SUCCESS_URL,
      payment_intent: null,
      livemode: false,
    });
    expect(session.url).toBe(`${payments.url}/pay/${session.id}`);
  });

  it('retrieves the session, with line items when expanded', async () => {
    const session = await stripe.checkout.sessions.retrieve(sessionId, { expand: ['line_items'] });
    expect(session.id).toBe(sessionId);
    expect(
      session.line_items?.data.map((line) => [line.description, line.quantity, line.amount_total]),
    ).toEqual([
      ['Deposit: garage floor, stage 1', 3, 12750],
      ['Edge ramps', 1, 1999],
    ]);
    const lines = await stripe.checkout.sessions.listLineItems(sessionId);
    expect(lines.data).toHaveLength(2);
  });

  it('answers an unknown id with resource_missing', async () => {
    await expect(stripe.checkout.sessions.retrieve('cs_test_nope')).rejects.toMatchObject({
      type: 'StripeInvalidRequestError',
      statusCode: 404,
      code: 'resource_missing',
    });
  });

  it('validates parameters like the processor does', async () => {
    await expect(
      stripe.checkout.sessions.create({ mode: 'payment' } as Stripe.Checkout.SessionCreateParams),
    ).rejects.toMatchObject({ statusCode: 400, code: 'parameter_missing', param: 'line_items' });
    await expect(
      newSession({ nonsense: 'x' } as Partial<Stripe.Checkout.SessionCreateParams>),
    ).rejects.toMatchObject({ statusCode: 400, code: 'parameter_unknown', param: 'nonsense' });
  });

  it('honours idempotency keys', async () => {
    const first = await newSession();
    const again = await stripe.checkout.sessions.create(
      {
        mode: 'payment',
        line_items: [
          {
            quantity: 1,
            price_data: { currency: 'gbp', unit_amount: 100, product_data: { name: 'Primer' } },
          },
        ],
      },
      { idempotencyKey: 'invoice-INV-0050-attempt-1' },
    );
    const replay = await stripe.checkout.sessions.create(
      {
        mode: 'payment',
        line_items: [
          {
            quantity: 1,
            price_data: { currency: 'gbp', unit_amount: 100, product_data: { name: 'Primer' } },
          },
        ],
      },
      { idempotencyKey: 'invoice-INV-0050-attempt-1' },
    );
    expect(replay.id).toBe(again.id);
    expect(replay.id).not.toBe(first.id);
    await expect(
      stripe.checkout.sessions.create(
        {
          mode: 'payment',
          line_items: [
            {
              quantity: 2,
              price_data: { currency: 'gbp', unit_amount: 100, product_data: { name: 'Primer' } },
            },
          ],
        },
        { idempotencyKey: 'invoice-INV-0050-attempt-1' },
      ),
    ).rejects.toMatchObject({ type: 'StripeIdempotencyError', statusCode: 400 });
  });

  it('shows its own pay page with the amount and lines, and nothing from another host', async () => {
    const page = await fetch(`${payments.url}/pay/${sessionId}`);
    expect(page.status).toBe(200);
    const html = await page.text();
    expect(html).toContain('Pay £147.49');
    expect(html).toContain('Deposit: garage floor, stage 1');
    expect(html).toContain('<label for="card_number">Card number</label>');
    expect(foreignUrls(html, payments.url).filter((url) => url !== CANCEL_URL)).toEqual([]);
  });

  it('declines the test decline card and leaves the session open', async () => {
    const response = await payOnPage(`${payments.url}/pay/${sessionId}`, '4000 0000 0000 0002');
    expect(response.status).toBe(402);
    expect(await response.text()).toContain('Your card was declined');
    expect((await stripe.checkout.sessions.retrieve(sessionId)).status).toBe('open');
  });

  it('pays on the pay page, redirects to success_url and sends a signed webhook (with a retry)', async () => {
    const response = await payOnPage(`${payments.url}/pay/${sessionId}`, '4242 4242 4242 4242');
    expect(response.status).toBe(303);
    expect(response.headers.get('location')).toBe(
      SUCCESS_URL.replace('{CHECKOUT_SESSION_ID}', sessionId),
    );

    const session = await stripe.checkout.sessions.retrieve(sessionId);
    expect(session).toMatchObject({ status: 'complete', payment_status: 'paid', url: null });
    expect(session.payment_intent).toMatch(/^pi_/);
    paymentIntentId = session.payment_intent as string;

    // The first delivery got a 500; the retry arrives.
    const delivery = await waitFor(() => received[0]);
    expect(failNextDeliveries).toBe(0);
    const event = stripe.webhooks.constructEvent(delivery.raw, delivery.signature, WEBHOOK_SECRET);
    expect(event.type).toBe('checkout.session.completed');
    const paid = event.data.object as Stripe.Checkout.Session;
    expect(paid).toMatchObject({
      id: sessionId,
      payment_status: 'paid',
      payment_intent: paymentIntentId,
      metadata: { tenant_id: 't-harbour', invoice_id: 'INV-0042' },
    });
    // A tampered body or a wrong secret fails verification.
    expect(() =>
      stripe.webhooks.constructEvent(
        Buffer.concat([delivery.raw, Buffer.from(' ')]),
        delivery.signature,
        WEBHOOK_SECRET,
      ),
    ).toThrow();
    expect(() =>
      stripe.webhooks.constructEvent(delivery.raw, delivery.signature, 'whsec_other'),
    ).toThrow();

    // Paying again does not charge twice.
    const twice = await payOnPage(`${payments.url}/pay/${sessionId}`, '4242 4242 4242 4242');
    expect(twice.status).toBe(303);
    await new Promise((resolve) => setTimeout(resolve, 150));
    expect(received).toHaveLength(1);
  });

  it('retrieves the succeeded PaymentIntent', async () => {
    const intent = await stripe.paymentIntents.retrieve(paymentIntentId);
    expect(intent).toMatchObject({
      object: 'payment_intent',
      status: 'succeeded',
      amount: 14749,
      amount_received: 14749,
      currency: 'gbp',
    });
    expect(intent.latest_charge).toMatch(/^ch_/);
  });

  it('refunds partly, then the rest, and refuses to refund more', async () => {
    const part = await stripe.refunds.create({ payment_intent: paymentIntentId, amount: 4000 });
    expect(part).toMatchObject({
      object: 'refund',
      amount: 4000,
      status: 'succeeded',
      payment_intent: paymentIntentId,
    });
    expect(part.id).toMatch(/^re_/);

    await expect(
      stripe.refunds.create({ payment_intent: paymentIntentId, amount: 20000 }),
    ).rejects.toMatchObject({
      type: 'StripeInvalidRequestError',
      statusCode: 400,
      code: 'amount_too_large',
      param: 'amount',
    });

    const rest = await stripe.refunds.create({ payment_intent: paymentIntentId });
    expect(rest.amount).toBe(14749 - 4000);

    await expect(
      stripe.refunds.create({ payment_intent: paymentIntentId, amount: 1 }),
    ).rejects.toMatchObject({
      statusCode: 400,
      code: 'charge_already_refunded',
    });
    const list = await stripe.refunds.list({ payment_intent: paymentIntentId });
    expect(list.data.map((r) => r.amount).sort((a, b) => a - b)).toEqual([4000, 10749]);
  });

  it('keeps sessions and payments across a restart', async () => {
    await payments.close();
    payments = await startPayments();
    stripe = sdk(SECRET_KEY, payments.port);
    const session = await stripe.checkout.sessions.retrieve(sessionId);
    expect(session.payment_status).toBe('paid');
    expect((await stripe.paymentIntents.retrieve(paymentIntentId)).status).toBe('succeeded');
  });
});
