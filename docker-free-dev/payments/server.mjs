// @ts-check
// The payments fake: an Express app speaking the card processor's REST shape, so the official
// `stripe` SDK works unchanged with { host: '127.0.0.1', port, protocol: 'http' }.
//   POST /v1/checkout/sessions            GET /v1/checkout/sessions/:id (expand line_items,
//   GET  /v1/checkout/sessions/:id/line_items        payment_intent)
//   POST /v1/checkout/sessions/:id/expire GET /v1/payment_intents/:id   GET /v1/charges/:id
//   POST /v1/refunds   GET /v1/refunds/:id   GET /v1/refunds   GET /v1/events(/:id)
//   GET  /pay/:id  POST /pay/:id  — the hosted pay page
//   GET  /health
// Secret-key Bearer auth, form bodies with nested keys, Idempotency-Key honoured on POSTs.
// Paying sends a signed `checkout.session.completed` event to the webhook URL, with retries.
import { randomBytes, timingSafeEqual } from 'node:crypto';
import http from 'node:http';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import express from 'express';
import { createLedger } from './ledger.mjs';
import { ApiError, listOf, noSuch } from './objects.mjs';
import { payPage, plainPage, successUrl } from './pay-page.mjs';
import { openState } from './state.mjs';
import { createWebhookSender } from './webhooks.mjs';

const here = dirname(fileURLToPath(import.meta.url));

/**
 * @typedef {object} PaymentsOptions
 * @property {number} [port] 0 picks a free port (tests); default 3430
 * @property {string} [host] default 127.0.0.1
 * @property {string} [secretKey] default sk_test_latchwork_local
 * @property {string} [webhookSecret] default whsec_latchwork_local
 * @property {string} [webhookUrl] default http://127.0.0.1:4200/api/v1/payments/webhook
 * @property {number[]} [webhookRetryDelaysMs] delays before each retry (tests shorten them)
 * @property {string} dataDir root data folder (LW_DATA_DIR); state goes to its payments/ subfolder
 */

/** @param {string} a @param {string} b */
function sameSecret(a, b) {
  const left = Buffer.from(a);
  const right = Buffer.from(b);
  return left.length === right.length && timingSafeEqual(left, right);
}

/** @param {string} key */
const redact = (key) =>
  key.length > 8 ? `${key.slice(0, 8)}${'*'.repeat(4)}${key.slice(-4)}` : '****';

/** Canonical JSON (sorted keys) for comparing the parameters of idempotent requests. */
/** @param {unknown} value @returns {string} */
function canonical(value) {
  if (Array.isArray(value)) return `[${value.map(canonical).join(',')}]`;
  if (value && typeof value === 'object') {
    return `{${Object.keys(value)
      .sort()
      .map((k) => `${JSON.stringify(k)}:${canonical(/** @type {any} */ (value)[k])}`)
      .join(',')}}`;
  }
  return JSON.stringify(value ?? null);
}

/** @param {unknown} value @returns {string[]} */
const expandParam = (value) =>
  Array.isArray(value)
    ? value.map(String)
    : value && typeof value === 'object'
      ? Object.values(value).map(String)
      : value
        ? [String(value)]
        : [];

/**
 * @param {PaymentsOptions} options
 * @returns {Promise<{ url: string, port: number, close(): Promise<void> }>}
 */
export async function start(options) {
  const {
    port = 3430,
    host = '127.0.0.1',
    secretKey = 'sk_test_latchwork_local',
    webhookSecret = 'whsec_latchwork_local',
    webhookUrl = 'http://127.0.0.1:4200/api/v1/payments/webhook',
    webhookRetryDelaysMs,
    dataDir,
  } = options;
  if (!dataDir) throw new Error('payments: dataDir is required');

  const store = openState(join(dataDir, 'payments'));
  const { state } = store;
  const webhooks = createWebhookSender({
    url: webhookUrl,
    secret: webhookSecret,
    retryDelaysMs: webhookRetryDelaysMs,
    store,
  });
  let baseUrl = '';
  const ledger = createLedger({ store, baseUrl: () => baseUrl, webhooks });

  const app = express();
  app.disable('x-powered-by');
  app.set('query parser', 'extended'); // expand[]=… and expand[0]=… as the SDK sends them
  app.get('/health', (_req, res) => {
    res.json({ status: 'ok' });
  });
  app.use('/assets', express.static(join(here, 'public'), { index: false, maxAge: '1h' }));

  // ------------------------------------------------------------------ the REST API
  const api = express.Router();
  api.use((req, res, next) => {
    res.set('Request-Id', `req_${randomBytes(7).toString('hex')}`);
    const header = req.get('authorization') ?? '';
    let key = '';
    if (/^Bearer /i.test(header)) key = header.slice(7).trim();
    else if (/^Basic /i.test(header)) {
      key = Buffer.from(header.slice(6), 'base64').toString('utf8').split(':')[0] ?? '';
    }
    if (!key) {
      throw new ApiError(
        401,
        "You did not provide an API key. You need to provide your API key in the Authorization header, using Bearer auth (e.g. 'Authorization: Bearer YOUR_SECRET_KEY').",
      );
    }
    if (!sameSecret(key, secretKey)) {
      throw new ApiError(401, `Invalid API Key provided: ${redact(key)}`);
    }
    res.locals['apiKey'] = key;
    next();
  });
  api.use(express.urlencoded({ extended: true, limit: '1mb', parameterLimit: 5000 }));

  // Idempotency-Key: the same key with the same parameters replays the first answer; with other
  // parameters it is refused. 5xx answers are not kept (the client may retry them).
  api.use((req, res, next) => {
    const key = req.get('idempotency-key');
    if (req.method !== 'POST' || !key) return next();
    const slot = `${res.locals['apiKey']}:${key}`;
    const fingerprint = `${req.method} ${req.path} ${canonical(req.body ?? {})}`;
    const previous = state.idempotency[slot];
    if (previous) {
      if (previous.fingerprint !== fingerprint) {
        throw new ApiError(
          400,
          `Keys for idempotent requests can only be used with the same parameters they were first used with. Try using a key other than '${key}' if you meant to execute a different request.`,
          { type: 'idempotency_error' },
        );
      }
      res.set({ 'Idempotent-Replayed': 'true', 'Idempotency-Key': key });
      res.status(previous.status).json(previous.body);
      return;
    }
    res.set('Idempotency-Key', key);
    const json = res.json.bind(res);
    res.json = (body) => {
      if (res.statusCode < 500) {
        state.idempotency[slot] = {
          fingerprint,
          status: res.statusCode,
          body,
          createdAt: Date.now(),
        };
        store.save();
      }
      return json(body);
    };
    next();
  });

  api.post('/checkout/sessions', (req, res) => {
    const apiVersion = req.get('stripe-version') ?? undefined;
    res.json(ledger.createCheckoutSession(req.body ?? {}, apiVersion ?? ''));
  });
  api.get('/checkout/sessions/:id', (req, res) => {
    const s = ledger.session(req.params.id);
    res.json(ledger.view(s, expandParam(req.query['expand'])));
  });
  api.get('/checkout/sessions/:id/line_items', (req, res) => {
    ledger.session(req.params.id);
    const all = ledger.lineItemList(req.params.id);
    res.json(listOf(all.data, all.url, req.query));
  });
  api.post('/checkout/sessions/:id/expire', (req, res) => {
    res.json(ledger.expire(req.params.id));
  });
  api.get('/payment_intents/:id', (req, res) => {
    const intent = state.paymentIntents[req.params.id];
    if (!intent) throw noSuch('payment_intent', req.params.id);
    const expand = expandParam(req.query['expand']);
    res.json(
      expand.includes('latest_charge')
        ? { ...intent, latest_charge: state.charges[intent['latest_charge']] }
        : intent,
    );
  });
  api.get('/charges/:id', (req, res) => {
    const charge = state.charges[req.params.id];
    if (!charge) throw noSuch('charge', req.params.id);
    res.json(charge);
  });
  api.post('/refunds', (req, res) => {
    res.json(ledger.createRefund(req.body ?? {}));
  });
  api.get('/refunds/:id', (req, res) => {
    const refund = state.refunds[req.params.id];
    if (!refund) throw noSuch('refund', req.params.id);
    res.json(refund);
  });
  api.get('/refunds', (req, res) => {
    const { payment_intent: intent, charge } = req.query;
    const refunds = Object.values(state.refunds)
      .filter(
        (r) => (!intent || r['payment_intent'] === intent) && (!charge || r['charge'] === charge),
      )
      .sort((a, b) => b['created'] - a['created']);
    res.json(listOf(refunds, '/v1/refunds', req.query));
  });
  api.get('/events/:id', (req, res) => {
    const event = state.events[req.params.id];
    if (!event) throw noSuch('event', req.params.id);
    res.json(event);
  });
  api.get('/events', (req, res) => {
    const type = req.query['type'];
    const events = Object.values(state.events)
      .filter((e) => !type || e['type'] === type)
      .sort((a, b) => b['created'] - a['created']);
    res.json(listOf(events, '/v1/events', req.query));
  });
  api.use((req) => {
    throw new ApiError(404, `Unrecognized request URL (${req.method}: ${req.originalUrl}).`);
  });
  app.use('/v1', api);

  // ------------------------------------------------------------------ the hosted pay page
  /**
   * @param {express.Request} _req
   * @param {express.Response} res
   * @param {express.NextFunction} next
   * @returns {void}
   */
  const pageHeaders = (_req, res, next) => {
    res.set({
      'Content-Security-Policy':
        "default-src 'none'; style-src 'self'; img-src 'self' data:; frame-ancestors 'none'; base-uri 'none'",
      'Cache-Control': 'no-store',
      'X-Content-Type-Options': 'nosniff',
      'Referrer-Policy': 'no-referrer',
    });
    next();
  };
  app.get('/pay/:id', pageHeaders, (req, res) => {
    const s = state.checkoutSessions[String(req.params['id'])];
    if (!s) {
      res.status(404).send(plainPage('Payment not found', 'This payment link is not valid.'));
      return;
    }
    ledger.session(s['id']); // marks it expired when due
    res.send(payPage(ledger.view(s), state.lineItems[s['id']] ?? []));
  });
  app.post(
    '/pay/:id',
    pageHeaders,
    express.urlencoded({ extended: false, limit: '16kb' }),
    (req, res) => {
      const s = state.checkoutSessions[String(req.params['id'])];
      if (!s) {
        res.status(404).send(plainPage('Payment not found', 'This payment link is not valid.'));
        return;
      }
      const cardNumber = String(req.body?.card_number ?? '');
      const email = String(req.body?.email ?? '').trim();
      try {
        ledger.pay(s['id'], { cardNumber, email, name: String(req.body?.name ?? '') });
      } catch (error) {
        if (!(error instanceof ApiError)) throw error;
        const status = s['status'] === 'open' ? error.status : 410;
        res.status(status).send(
          payPage(ledger.view(s), state.lineItems[s['id']] ?? [], {
            error: error.message,
            cardNumber,
            email,
          }),
        );
        return;
      }
      res.redirect(303, s['success_url'] ? successUrl(s) : `/pay/${s['id']}`);
    },
  );

  /**
   * @param {any} error
   * @param {express.Request} _req
   * @param {express.Response} res
   * @param {express.NextFunction} _next
   * @returns {void}
   */
  const onError = (error, _req, res, _next) => {
    if (error instanceof ApiError) {
      res.status(error.status).json(error.toJSON());
      return;
    }
    const status = Number(error?.status ?? error?.statusCode ?? 500);
    if (status >= 400 && status < 500) {
      res
        .status(status)
        .json(new ApiError(status, String(error.message ?? 'Bad request')).toJSON());
      return;
    }
    console.error('payments:', error);
    res.status(500).json(
      new ApiError(500, 'An error occurred in the payments fake.', {
        type: 'api_error',
      }).toJSON(),
    );
  };
  app.use(onError);

  const server = http.createServer(app);
  await new Promise((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, host, () => {
      server.off('error', reject);
      resolve(undefined);
    });
  });
  const actualPort = /** @type {import('node:net').AddressInfo} */ (server.address()).port;
  baseUrl = `http://${host}:${actualPort}`;
  webhooks.resume();

  return {
    url: baseUrl,
    port: actualPort,
    async close() {
      await webhooks.close();
      await new Promise((resolve) => {
        server.close(() => resolve(undefined));
        server.closeAllConnections();
      });
      store.save();
    },
  };
}
