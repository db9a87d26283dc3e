// @ts-check
// Reads and checks the parameters of "create a Checkout Session" the way the card processor
// does: form-encoded nested keys, unknown parameters refused, errors naming the parameter.
import {
  ApiError,
  integerParam,
  invalid,
  metadataParam,
  missing,
  newId,
  nowSeconds,
} from './objects.mjs';

// Parameters accepted and ignored: the product may send them, they change nothing here.
const IGNORED_SESSION_PARAMS = new Set([
  'allow_promotion_codes',
  'billing_address_collection',
  'consent_collection',
  'custom_text',
  'customer_creation',
  'expand',
  'locale',
  'payment_method_types',
  'phone_number_collection',
  'submit_type',
]);
const SESSION_PARAMS = new Set([
  'mode',
  'line_items',
  'metadata',
  'success_url',
  'cancel_url',
  'customer_email',
  'client_reference_id',
  'currency',
  'expires_at',
  'payment_intent_data',
  ...IGNORED_SESSION_PARAMS,
]);

/** @param {unknown} value @returns {unknown[]} */
const asArray = (value) =>
  Array.isArray(value) ? value : value && typeof value === 'object' ? Object.values(value) : [];

/** @param {unknown} value @param {string} param */
function urlParam(value, param) {
  if (value === undefined || value === '') return null;
  try {
    const url = new URL(String(value));
    if (url.protocol !== 'http:' && url.protocol !== 'https:') throw new Error('scheme');
    return String(value);
  } catch {
    throw invalid(param, 'Not a valid URL');
  }
}

/**
 * @param {Record<string, any>} params a parsed form body
 */
export function parseCheckoutSessionParams(params) {
  for (const key of Object.keys(params)) {
    if (!SESSION_PARAMS.has(key)) {
      throw new ApiError(400, `Received unknown parameter: ${key}`, {
        code: 'parameter_unknown',
        param: key,
      });
    }
  }
  if (!params['mode']) throw missing('mode');
  if (params['mode'] !== 'payment') {
    throw invalid('mode', 'The payments fake supports mode=payment only.');
  }
  const rawItems = asArray(params['line_items']);
  if (rawItems.length === 0) throw missing('line_items');
  let currency = params['currency'] ? String(params['currency']).toLowerCase() : undefined;
  const items = rawItems.map((raw, index) => {
    const item = /** @type {Record<string, any>} */ (raw);
    const at = `line_items[${index}]`;
    if (item['price']) throw invalid(`${at}[price]`, 'The payments fake supports price_data only.');
    const priceData = item['price_data'];
    if (!priceData || typeof priceData !== 'object') throw missing(`${at}[price_data]`);
    const itemCurrency = String(priceData['currency'] ?? '').toLowerCase();
    if (!/^[a-z]{3}$/.test(itemCurrency)) throw missing(`${at}[price_data][currency]`);
    currency ??= itemCurrency;
    if (itemCurrency !== currency) {
      throw invalid(`${at}[price_data][currency]`, 'All line items must use the same currency.');
    }
    if (priceData['unit_amount'] === undefined) throw missing(`${at}[price_data][unit_amount]`);
    const unitAmount = integerParam(priceData['unit_amount'], `${at}[price_data][unit_amount]`);
    const productName = priceData['product_data']?.['name'];
    if (!productName) throw missing(`${at}[price_data][product_data][name]`);
    const quantity =
      item['quantity'] === undefined
        ? 1
        : integerParam(item['quantity'], `${at}[quantity]`, { min: 1 });
    const total = unitAmount * quantity;
    return {
      id: newId('li', 24),
      object: 'item',
      amount_discount: 0,
      amount_subtotal: total,
      amount_tax: 0,
      amount_total: total,
      currency,
      description: String(productName),
      price: {
        id: newId('price', 24),
        object: 'price',
        active: false,
        billing_scheme: 'per_unit',
        created: nowSeconds(),
        currency,
        livemode: false,
        metadata: {},
        product: newId('prod', 14),
        type: 'one_time',
        unit_amount: unitAmount,
        unit_amount_decimal: String(unitAmount),
      },
      quantity,
    };
  });
  const amount = items.reduce((sum, item) => sum + item.amount_total, 0);
  const created = nowSeconds();
  const expiresAt =
    params['expires_at'] === undefined
      ? created + 24 * 60 * 60
      : integerParam(params['expires_at'], 'expires_at', { min: created + 60 });
  const intentData = params['payment_intent_data'] ?? {};
  return {
    currency: /** @type {string} */ (currency),
    items,
    amount,
    created,
    expiresAt,
    successUrl: urlParam(params['success_url'], 'success_url'),
    cancelUrl: urlParam(params['cancel_url'], 'cancel_url'),
    customerEmail: params['customer_email'] ? String(params['customer_email']) : null,
    clientReferenceId: params['client_reference_id'] ? String(params['client_reference_id']) : null,
    metadata: metadataParam(params['metadata']),
    intent: {
      metadata: metadataParam(intentData['metadata'], 'payment_intent_data[metadata]'),
      description: intentData['description'] ? String(intentData['description']) : null,
    },
  };
}
