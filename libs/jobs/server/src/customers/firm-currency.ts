import type { TenantScope, Tx } from '@latchwork/shared-db';

/**
 * Minor-unit digits of an ISO 4217 currency (GBP 2, JPY 0, BHD 3), from the runtime's
 * ICU data, which carries the ISO table; 2 for a code it does not know.
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

/** The firm's currency and its minor digits, for money on the customer page and in imports. */
export async function firmCurrency(tx: Tx, scope: TenantScope) {
  const { currency } = await tx
    .selectFrom('tenant')
    .select('currency')
    .where('id', '=', scope.tenantId)
    .executeTakeFirstOrThrow();
  return { currency, minorDigits: minorDigitsOf(currency) };
}
