import type { EndpointDef } from '@latchwork/shared-server-kit';
import type { StockDeps } from './stock-deps';

export type { StockDeps } from './stock-deps';
export * from './ledger';

/** Catalogue, locations and batches, the stock ledger, reservations, counts and purchasing. */
export function stockEndpoints(_deps: StockDeps): EndpointDef[] {
  return [];
}
