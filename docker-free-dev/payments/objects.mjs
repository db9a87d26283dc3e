// @ts-check
// Ids, errors and money formatting in the card processor's conventions.
import { randomBytes } from 'node:crypto';

const ALPHABET = '0123456789ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz';

/**
 * An id with the processor's prefix, e.g. `cs_test_…`, `pi_…`, `re_…`, `evt_…`.
 * @param {string} prefix
 * @param {number} [length]
 */
export function newId(prefix, length = 24) {
  const bytes = randomBytes(length);
  let out = '';
  for (const byte of bytes) out += ALPHABET[byte % ALPHABET.length];
  return `${prefix}_${out}`;
}

export const nowSeconds = () => Math.floor(Date.now() / 1000);

/** An error answered in the processor's shape: `{ "error": { type, code?, param?, message } }`. */
export class ApiError extends Error {
  /**
   * @param {number} status
   * @param {string} message
   * @param {{ type?: string, code?: string, param?: string }} [details]
   */
  constructor(status, message, { type = 'invalid_request_error', code, param } = {}) {
    super(message);
    this.status = status;
    this.type = type;
    this.code = code;
    this.param = param;
  }
  toJSON() {
    return {
      error: {
        type: this.type,
        message: this.message,
        ...(this.code ? { code: this.code } : {}),
        ...(this.param ? { param: this.param } : {}),
      },
    };
  }
}

/** @param {string} param */
export const missing = (param) =>
  new ApiError(400, `Missing required param: ${param}.`, { code: 'parameter_missing', param });

/** @param {string} param @param {string} message */
export const invalid = (param, message) =>
  new ApiError(400, message, { code: 'parameter_invalid', param });

/** @param {string} objectName e.g. checkout.session @param {string} id @param {string} [param] */
export const noSuch = (objectName, id, param = 'id') =>
  new ApiError(404, `No such ${objectName}: '${id}'`, { code: 'resource_missing', param });

/**
 * An integer parameter (form bodies carry text).
 * @param {unknown} value
 * @param {string} param
 * @param {{ min?: number }} [limits]
 */
export function integerParam(value, param, { min = 0 } = {}) {
  const text = String(value);
  if (!/^-?\d+$/.test(text)) {
    throw new ApiError(400, `Invalid integer: ${text}`, {
      code: 'parameter_invalid_integer',
      param,
    });
  }
  const number = Number(text);
  if (!Number.isSafeInteger(number) || number < min) {
    throw new ApiError(400, `This value must be greater than or equal to ${min}.`, {
      code: 'parameter_invalid_integer',
      param,
    });
  }
  return number;
}

/**
 * Metadata: up to 50 keys of text, as the processor allows.
 * @param {unknown} value
 * @param {string} [param]
 * @returns {Record<string, string>}
 */
export function metadataParam(value, param = 'metadata') {
  if (value === undefined || value === '') return {};
  if (typeof value !== 'object' || value === null || Array.isArray(value)) {
    throw invalid(param, 'Invalid object');
  }
  const entries = Object.entries(value);
  if (entries.length > 50) throw invalid(param, 'Metadata can have at most 50 keys.');
  /** @type {Record<string, string>} */
  const out = {};
  for (const [key, text] of entries) {
    if (typeof text !== 'string')
      throw invalid(`${param}[${key}]`, 'Metadata values must be strings.');
    if (key.length > 40 || text.length > 500) {
      throw invalid(
        `${param}[${key}]`,
        'Metadata keys are at most 40 and values at most 500 characters.',
      );
    }
    out[key] = text;
  }
  return out;
}

/**
 * A list in the processor's shape, paged with `limit` and `starting_after`.
 * @param {Record<string, any>[]} items newest first
 * @param {string} url
 * @param {Record<string, any>} query
 */
export function listOf(items, url, query) {
  const limit =
    query['limit'] === undefined ? 10 : integerParam(query['limit'], 'limit', { min: 1 });
  let start = 0;
  if (query['starting_after']) {
    start = items.findIndex((item) => item['id'] === query['starting_after']) + 1;
  }
  const page = items.slice(start, start + Math.min(limit, 100));
  return { object: 'list', data: page, has_more: start + page.length < items.length, url };
}

/**
 * Formats minor units for people, e.g. 12345 GBP → £123.45 (zero-decimal currencies too).
 * @param {number} amount
 * @param {string} currency
 */
export function formatMoney(amount, currency) {
  try {
    const format = new Intl.NumberFormat('en-GB', {
      style: 'currency',
      currency: currency.toUpperCase(),
    });
    const digits = format.resolvedOptions().maximumFractionDigits ?? 2;
    return format.format(amount / 10 ** digits);
  } catch {
    return `${amount} ${currency.toUpperCase()} (minor units)`;
  }
}
