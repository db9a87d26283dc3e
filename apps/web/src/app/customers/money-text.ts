import { formatMinor, parseMoneyToMinor } from '@latchwork/jobs-domain';

/**
 * Minor-unit digits of an ISO 4217 currency (GBP 2, JPY 0, BHD 3) from the browser's ICU
 * data; 2 for a code it does not know.
 */
export function minorDigitsOf(currency: string): number {
  try {
    return (
      new Intl.NumberFormat('en', { style: 'currency', currency }).resolvedOptions()
        .maximumFractionDigits ?? 2
    );
  } catch {
    return 2;
  }
}

/**
 * Integer minor units shown as money of the firm's currency ("£2,500.00"). The figure goes to
 * Intl as a decimal string, never through a float division.
 */
export function moneyText(minor: number | null, currency: string): string {
  if (minor === null) return '—';
  const digits = minorDigitsOf(currency);
  const decimal = formatMinor(minor, digits) as Intl.StringNumericLiteral;
  return new Intl.NumberFormat('en-GB', { style: 'currency', currency }).format(decimal);
}

/** Money as typed into a form ("2,500", "£2500.50") → minor units; null if empty; NaN if bad. */
export function parseMoneyInput(text: string, currency: string): number | null {
  if (!text.trim()) return null;
  return parseMoneyToMinor(text, minorDigitsOf(currency)) ?? Number.NaN;
}

/** Minor units as the plain decimal a form field shows ("2500.00"). */
export function moneyInputText(minor: number | null, currency: string): string {
  return minor === null ? '' : formatMinor(minor, minorDigitsOf(currency));
}
