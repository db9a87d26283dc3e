import { formatMoney, formatPacks, parseMoney, parseQuantity } from '@latchwork/stock-domain';
import { minorDigitsOf } from '../customers/money-text';

/** Labels of the product kinds, in the catalogue's order. */
export const KIND_LABELS: Readonly<Partial<Record<string, string>>> = {
  tile: 'Tile',
  ramp: 'Ramp',
  corner_piece: 'Corner piece',
  skirting: 'Skirting',
  corner_trim: 'Corner trim',
  adhesive: 'Adhesive',
  hardener: 'Hardener',
  primer: 'Primer',
  filler: 'Filler',
  tape: 'Tape',
  mastic: 'Mastic',
  hire_tool: 'Hire tool',
  labour: 'Labour',
  other: 'Other',
};

export const MOVEMENT_LABELS: Readonly<Record<string, string>> = {
  receipt: 'Goods in',
  transfer: 'Transfer',
  issue: 'Issue to job',
  return: 'Return from job',
  adjustment: 'Adjustment',
  count_correction: 'Count correction',
  write_off: 'Write-off',
};

/** Minor digits of the firm's currency (shared with the customer pages). */
export const currencyDigits = minorDigitsOf;

/** Minor units as money ("£43.00"): the decimal text goes to Intl, never a float division. */
export function moneyText(minor: number | null, currency: string): string {
  if (minor === null) return '—';
  const text = formatMoney(minor, currencyDigits(currency)) as Intl.StringNumericLiteral;
  return new Intl.NumberFormat('en-GB', { style: 'currency', currency }).format(text);
}

/** Decimal text typed in a money field → minor units; null when empty, NaN when not money. */
export function moneyInput(text: string, currency: string): number | null {
  const t = text.trim().replace(/,/g, '');
  if (!t) return null;
  try {
    return parseMoney(t, currencyDigits(currency));
  } catch {
    return Number.NaN;
  }
}

/** Decimal text typed in a quantity field → steps of the unit; NaN when it does not fit. */
export function quantityInput(text: string, decimals: number): number {
  try {
    return parseQuantity(text.trim(), decimals);
  } catch {
    return Number.NaN;
  }
}

/** A quantity with its packs: "3 boxes + 5 tiles". */
export function packsOf(
  p: {
    packSize: number;
    unitOne: string;
    unitOther: string;
    packOne: string;
    packOther: string;
    decimals: number;
  },
  quantity: number,
): string {
  return formatPacks(
    quantity,
    p.packSize,
    { unit: { one: p.unitOne, other: p.unitOther }, pack: { one: p.packOne, other: p.packOther } },
    p.decimals,
  );
}
