export * from './database';
export * from './connect';
export * from './tenant-scope';
export * from './migrate';
export * from './audit';
export type * from './tables/column-types';
export type { CustomerKind } from './tables/customers-tables';
export type { JobStage } from './tables/jobs-tables';
export type {
  KitComponent,
  ProductKind,
  ReservationStatus,
  StockLocationKind,
  StockMovementKind,
  SupplierContact,
  WriteOffReason,
} from './tables/stock-tables';
export type {
  PurchaseOrderStatus,
  StockCountReason,
  StockCountStatus,
} from './tables/purchasing-tables';
export * from './counters';
