import type { ColumnType, Generated } from 'kysely';
import type {
  CreatedAt,
  DateOnly,
  Defaulted,
  DefaultedTimestamp,
  MinorUnits,
  Timestamp,
} from './column-types';

/** A bigint (steps or minor units): read as text, written as number, bigint or text. */
type Big = ColumnType<string, number | bigint | string, number | bigint | string>;
/** A bigint with a database default. */
type DefaultedBig = ColumnType<
  string,
  number | bigint | string | undefined,
  number | bigint | string
>;
export type StockCountStatus = 'counting' | 'submitted' | 'posted' | 'cancelled';
export type StockCountReason =
  | 'miscount'
  | 'damaged'
  | 'lost'
  | 'unrecorded_issue'
  | 'unrecorded_receipt'
  | 'wrong_location'
  | 'other';
export type PurchaseOrderStatus = 'draft' | 'sent' | 'part_received' | 'received' | 'cancelled';

/** Stock counts, purchase orders and goods in, and their settings (migration 2026_12_02_0230). */
export interface PurchasingTables {
  stockControlSetting: {
    tenantId: string;
    /** Σ |variance value| of a count above which the owner must approve it. */
    countApprovalGrossMinor: DefaultedBig;
    /** One line's |variance value| above which the owner must approve; null: no line limit. */
    countApprovalLineMinor: MinorUnits | null;
    demandWindowDays: Defaulted<number>;
    nightlyReorder: Defaulted<boolean>;
    /** Cost of placing one order when the supplier names none. */
    defaultOrderCostMinor: DefaultedBig;
    /** Where the reorder run's draft orders are delivered; null: the first warehouse. */
    deliveryLocationId: string | null;
    updatedAt: DefaultedTimestamp;
  };
  stockCount: {
    id: Generated<string>;
    tenantId: string;
    locationId: string;
    scope: 'all' | 'chosen';
    status: Defaulted<StockCountStatus>;
    note: Defaulted<string>;
    startedBy: string | null;
    startedAt: CreatedAt;
    submittedBy: string | null;
    submittedAt: Timestamp | null;
    approvedBy: string | null;
    approvedAt: Timestamp | null;
    postedBy: string | null;
    postedAt: Timestamp | null;
    netValueMinor: MinorUnits | null;
    grossValueMinor: MinorUnits | null;
  };
  stockCountLine: {
    id: Generated<string>;
    tenantId: string;
    countId: string;
    position: number;
    productId: string;
    batchId: string | null;
    /** The balance when the count started (never shown to the counter). */
    expectedAtStart: Big;
    counted: Big | null;
    countedBy: string | null;
    countedAt: Timestamp | null;
    reason: StockCountReason | null;
    reasonNote: Defaulted<string>;
    expected: Big | null;
    variance: Big | null;
    unitCostMinor: MinorUnits | null;
    varianceValueMinor: MinorUnits | null;
    movementId: string | null;
  };
  purchaseOrderCounter: {
    tenantId: string;
    lastNumber: number;
  };
  purchaseOrder: {
    id: Generated<string>;
    tenantId: string;
    number: number;
    reference: string;
    supplierId: string;
    status: Defaulted<PurchaseOrderStatus>;
    source: Defaulted<'manual' | 'reorder'>;
    deliveryLocationId: string | null;
    expectedOn: DateOnly | null;
    notes: Defaulted<string>;
    createdBy: string | null;
    createdAt: CreatedAt;
    updatedAt: DefaultedTimestamp;
    sentBy: string | null;
    sentAt: Timestamp | null;
    sentTo: string | null;
    emailLogId: string | null;
    cancelledBy: string | null;
    cancelledAt: Timestamp | null;
    cancelReason: string | null;
  };
  purchaseOrderLine: {
    id: Generated<string>;
    tenantId: string;
    purchaseOrderId: string;
    position: number;
    productId: string;
    /** Ordered, in stock steps. */
    quantity: Big;
    /** Per whole stock unit. */
    unitCostMinor: MinorUnits;
    /** Good units booked into stock against this line. */
    receivedQuantity: DefaultedBig;
    /** Units that arrived damaged (booked in, then written off; still owed by the supplier). */
    damagedQuantity: DefaultedBig;
    note: Defaulted<string>;
  };
  goodsReceipt: {
    id: Generated<string>;
    tenantId: string;
    purchaseOrderId: string;
    locationId: string;
    receivedOn: DateOnly;
    note: Defaulted<string>;
    receivedBy: string | null;
    createdAt: CreatedAt;
  };
  goodsReceiptLine: {
    id: Generated<string>;
    tenantId: string;
    goodsReceiptId: string;
    purchaseOrderLineId: string;
    productId: string;
    batchId: string | null;
    quantity: Big;
    damagedQuantity: DefaultedBig;
    unitCostMinor: MinorUnits;
    receiptMovementId: string | null;
    writeOffMovementId: string | null;
  };
}
