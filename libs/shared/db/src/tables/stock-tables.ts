import type { ColumnType, Generated } from 'kysely';
import type {
  CreatedAt,
  DateOnly,
  Defaulted,
  DefaultedTimestamp,
  MinorUnits,
} from './column-types';

/** Product kinds as stored (migration 2026_12_02_0200). */
export type ProductKind =
  | 'tile'
  | 'ramp'
  | 'corner_piece'
  | 'skirting'
  | 'corner_trim'
  | 'adhesive'
  | 'hardener'
  | 'primer'
  | 'filler'
  | 'tape'
  | 'mastic'
  | 'hire_tool'
  | 'labour'
  | 'other';

export type StockLocationKind = 'warehouse' | 'van' | 'site';

/** Ledger movement kinds as stored. */
export type StockMovementKind =
  | 'receipt'
  | 'transfer'
  | 'issue'
  | 'return'
  | 'adjustment'
  | 'count_correction'
  | 'write_off';

export type WriteOffReason = 'damaged' | 'expired' | 'lost';
export type ReservationStatus = 'active' | 'fulfilled' | 'released';

/** A bigint quantity in stock steps: read as text, written as number or text. */
export type Steps = ColumnType<string, number | bigint | string, number | bigint | string>;
/** A bigint (steps or minor units) with a database default. */
type DefaultedBigint = ColumnType<
  string,
  number | bigint | string | undefined,
  number | bigint | string
>;
/** jsonb: read as parsed JSON, written as a JSON string (pg would send an array as a PG array). */
type Json<T> = ColumnType<T, string | undefined, string>;

/** A component of a kit (two-part adhesive = resin + hardener), in the component's steps. */
export interface KitComponent {
  productId: string;
  quantity: number;
}

/** A supplier's contact person. */
export interface SupplierContact {
  name: string;
  role?: string;
  email?: string;
  phone?: string;
}

/** The catalogue, stock locations, batches, the ledger, balances and reservations. */
export interface StockTables {
  supplier: {
    id: Generated<string>;
    tenantId: string;
    name: string;
    email: string | null;
    phone: string | null;
    accountRef: string | null;
    addressLines: Defaulted<string[]>;
    contacts: Json<SupplierContact[]>;
    leadTimeDays: Defaulted<number>;
    /** Cost of placing one order, for the economic order quantity. */
    orderCostMinor: MinorUnits | null;
    notes: Defaulted<string>;
    active: Defaulted<boolean>;
    createdAt: CreatedAt;
    updatedAt: DefaultedTimestamp;
  };
  product: {
    id: Generated<string>;
    tenantId: string;
    sku: string;
    name: string;
    kind: ProductKind;
    /** By kind: colour, thicknessMm, finish, pitchMm (tiles); coverageM2 (adhesive…); lengthMm. */
    attributes: Json<Record<string, unknown>>;
    unitOne: Defaulted<string>;
    unitOther: Defaulted<string>;
    /** Decimals of the stock unit: quantities are integer steps of 10^-decimals units. */
    decimals: Defaulted<number>;
    packOne: Defaulted<string>;
    packOther: Defaulted<string>;
    /** Steps per pack (24 tiles in a box). */
    packSize: DefaultedBigint;
    kitComponents: Json<KitComponent[]>;
    /** Per whole stock unit. */
    costMinor: DefaultedBigint;
    priceMinor: DefaultedBigint;
    taxRateBp: Defaulted<number>;
    preferredSupplierId: string | null;
    serviceLevelBp: number | null;
    /** Overrides the preferred supplier's lead time. */
    leadTimeDays: number | null;
    minOrderQuantity: Steps | null;
    roundToPacks: Defaulted<boolean>;
    shelfLifeDays: number | null;
    active: Defaulted<boolean>;
    createdAt: CreatedAt;
    updatedAt: DefaultedTimestamp;
  };
  stockLocation: {
    id: Generated<string>;
    tenantId: string;
    name: string;
    kind: StockLocationKind;
    jobId: string | null;
    siteId: string | null;
    notes: Defaulted<string>;
    active: Defaulted<boolean>;
    createdAt: CreatedAt;
  };
  stockBatch: {
    id: Generated<string>;
    tenantId: string;
    productId: string;
    code: string;
    receivedOn: DateOnly;
    /** The last good day; null for goods that do not expire. */
    expiresOn: DateOnly | null;
    supplierId: string | null;
    createdAt: CreatedAt;
  };
  reservation: {
    id: Generated<string>;
    tenantId: string;
    jobId: string;
    productId: string;
    batchId: string | null;
    locationId: string | null;
    quantity: Steps;
    issuedQuantity: DefaultedBigint;
    status: Defaulted<ReservationStatus>;
    note: Defaulted<string>;
    createdBy: string | null;
    createdAt: CreatedAt;
    updatedAt: DefaultedTimestamp;
  };
  /** Append-only (the app role may only select and insert). */
  stockMovement: {
    id: Generated<string>;
    seq: ColumnType<string, never, never>;
    tenantId: string;
    kind: StockMovementKind;
    productId: string;
    batchId: string | null;
    fromLocationId: string | null;
    toLocationId: string | null;
    /** Always positive; the direction is from → to. */
    quantity: Steps;
    /** Per whole unit: the cost given (inflows) or the average it left at (outflows). */
    unitCostMinor: MinorUnits;
    /** The exact value booked: + into stock, − out of it, 0 for a transfer. */
    valueMinor: MinorUnits;
    /** Cost difference settled by an inflow that fills a negative balance. */
    settlementMinor: DefaultedBigint;
    jobId: string | null;
    reservationId: string | null;
    writeOffReason: WriteOffReason | null;
    reversesMovementId: string | null;
    /** The owner's reason for issuing an expired batch. */
    overrideReason: string | null;
    note: Defaulted<string>;
    userId: string | null;
    at: DefaultedTimestamp;
  };
  stockBalance: {
    tenantId: string;
    productId: string;
    batchId: string | null;
    locationId: string;
    quantity: DefaultedBigint;
    updatedAt: DefaultedTimestamp;
  };
  productCostState: {
    tenantId: string;
    productId: string;
    quantity: DefaultedBigint;
    /** Exact stock value (never a rounded average). */
    valueMinor: DefaultedBigint;
    lastUnitCostMinor: MinorUnits | null;
    updatedAt: DefaultedTimestamp;
  };
  stockSetting: {
    tenantId: string;
    allowNegativeStock: Defaulted<boolean>;
    expiryWarningDays: Defaulted<number>;
    defaultServiceLevelBp: Defaulted<number>;
    /** Yearly holding cost as a share of unit cost, in basis points. */
    holdingCostRateBp: Defaulted<number>;
    updatedAt: DefaultedTimestamp;
  };
}
