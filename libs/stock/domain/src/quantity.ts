/**
 * Quantities in stock units. Every quantity is an integer count of the product's smallest
 * step: tiles, boxes, kits, lengths and tools are counted whole (`decimals` 0); a unit that
 * is genuinely divisible — metres of skirting or trim cut from a coil, litres drawn from a
 * drum — has `decimals` 1–3, so metres with 3 decimals are counted in millimetres, the
 * project's internal length. Unit costs are always per whole unit (per metre, per kit), as
 * suppliers price them.
 */
import { formatDecimal, parseDecimal } from './money';
import { scaleOf } from './rounding';

/** A word in its singular and plural form: `{ one: 'box', other: 'boxes' }`. */
export interface Noun {
  one: string;
  other: string;
}

/** Names for the stock unit and its pack, e.g. tile/tiles in box/boxes. */
export interface UnitNames {
  unit: Noun;
  pack: Noun;
}

/** "2.5" metres with 3 decimals → 2500 steps. Refuses more decimals than the unit has. */
export function parseQuantity(text: string, decimals = 0): number {
  return parseDecimal(text, decimals);
}

/** 2500 steps with 3 decimals → "2.5"; whole units print without a point. */
export function formatQuantity(steps: number, decimals = 0): string {
  const s = formatDecimal(steps, decimals);
  return decimals > 0 ? s.replace(/\.?0+$/, '') : s;
}

/**
 * English plural choice: exactly one whole unit is singular ("1 tile", "1 box"); zero,
 * many and fractions are plural ("0 tiles", "1.5 metres"), as common practice writes them.
 */
function counted(steps: number, decimals: number, noun: Noun): string {
  return `${formatQuantity(steps, decimals)} ${steps === scaleOf(decimals) ? noun.one : noun.other}`;
}

/**
 * A stock quantity shown as whole packs plus loose units: 77 tiles in boxes of 24 →
 * "3 boxes + 5 tiles"; 48 → "2 boxes"; 5 → "5 tiles"; 0 → "0 tiles". A negative balance
 * (allowed for some tenants) reads "-(3 boxes + 5 tiles)". `quantity` and `packSize` are in
 * the same steps (see `decimals`); a pack size of 1 or less shows units only.
 */
export function formatPacks(
  quantity: number,
  packSize: number,
  names: UnitNames,
  decimals = 0,
): string {
  if (!Number.isSafeInteger(quantity)) throw new RangeError('quantity must be an integer');
  if (!Number.isSafeInteger(packSize)) throw new RangeError('packSize must be an integer');
  const abs = Math.abs(quantity);
  const sign = quantity < 0 ? '-' : '';
  if (packSize <= 1 || abs < packSize) return sign + counted(abs, decimals, names.unit);
  const packs = Math.floor(abs / packSize);
  const loose = abs % packSize;
  const packText = `${packs} ${packs === 1 ? names.pack.one : names.pack.other}`;
  if (loose === 0) return sign + packText;
  const text = `${packText} + ${counted(loose, decimals, names.unit)}`;
  return sign ? `-(${text})` : text;
}

/** Whole packs needed to hold at least `quantity` (rounded up; 0 for nothing). */
export function packsToCover(quantity: number, packSize: number): number {
  if (packSize <= 0) throw new RangeError('packSize must be positive');
  return quantity <= 0 ? 0 : Math.ceil(quantity / packSize);
}
