import type { EndpointDef } from '@latchwork/shared-server-kit';
import type { StockDeps } from './stock-deps';
import { productEndpoints } from './catalogue/product.endpoints';
import { catalogueImportEndpoints } from './catalogue/catalogue-import.endpoints';
import { supplierEndpoints } from './catalogue/supplier.endpoints';
import { placesEndpoints } from './places/places.endpoints';
import { movementEndpoints } from './ledger/movement.endpoints';
import { reservationEndpoints } from './reservations/reservation.endpoints';
import { reportEndpoints } from './reports/report.endpoints';
import { countEndpoints } from './counts/count.endpoints';
import { purchaseOrderEndpoints } from './purchasing/po.endpoints';
import { reorderEndpoints } from './reorder/reorder.endpoints';
import { controlSettingsEndpoints } from './reorder/control-settings';

export type { StockDeps } from './stock-deps';
export * from './ledger';
export { runReorder, type ReorderResult } from './reorder/reorder-run';
export * from './counts';
export * from './purchasing';

/** Catalogue, locations and batches, the stock ledger, reservations, counts and purchasing. */
export function stockEndpoints(deps: StockDeps): EndpointDef[] {
  return [
    ...catalogueImportEndpoints(deps),
    ...productEndpoints(deps),
    ...supplierEndpoints(deps),
    ...placesEndpoints(deps),
    ...movementEndpoints(deps),
    ...reservationEndpoints(deps),
    ...reportEndpoints(deps),
    ...controlSettingsEndpoints(deps),
    ...countEndpoints(deps),
    ...reorderEndpoints(deps),
    ...purchaseOrderEndpoints(deps),
  ];
}
