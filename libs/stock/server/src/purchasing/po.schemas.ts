/** Request schemas of purchase orders and goods in. Quantities come as packs + loose units. */
import { z } from 'zod';
import { packQuantity } from './product-facts';

const money = z.number().int().min(0).max(1e13);
const isoDate = z.iso.date();

export const purchaseOrderIdParams = z.object({ purchaseOrderId: z.uuid() });

export const purchaseOrderBody = z.object({
  supplierId: z.uuid(),
  deliveryLocationId: z.uuid().nullable().default(null),
  expectedOn: isoDate.nullable().default(null),
  notes: z.string().trim().max(2000).default(''),
  lines: z
    .array(
      z.object({
        productId: z.uuid(),
        ...packQuantity,
        /** Per whole stock unit; the catalogue cost when left out. */
        unitCostMinor: money.optional(),
        note: z.string().trim().max(500).default(''),
      }),
    )
    .min(1)
    .max(500),
});
export type PurchaseOrderBody = z.output<typeof purchaseOrderBody>;

export const PO_STATUSES = ['draft', 'sent', 'part_received', 'received', 'cancelled'] as const;

export const purchaseOrderQuery = z.object({
  status: z.enum([...PO_STATUSES, 'open']).optional(),
  supplierId: z.uuid().optional(),
  limit: z.coerce.number().int().min(1).max(200).default(50),
});

export const sendBody = z.object({
  /** The supplier's order address; the supplier's e-mail when left out. */
  to: z.email().max(320).optional(),
  message: z.string().trim().max(2000).default(''),
});

export const cancelBody = z.object({ reason: z.string().trim().min(1).max(500) });

export const goodsInBody = z.object({
  /** Where the goods are put; the order's delivery location when left out. */
  locationId: z.uuid().optional(),
  /** The day they arrived; today when left out. */
  receivedOn: isoDate.optional(),
  note: z.string().trim().max(1000).default(''),
  lines: z
    .array(
      z.object({
        purchaseOrderLineId: z.uuid(),
        /** Good units received: whole packs plus loose units. */
        ...packQuantity,
        /** Units that arrived damaged, in stock steps: booked in, then written off. */
        damaged: z.number().int().min(0).max(1e12).default(0),
        /** An existing batch of the product, or a new one with this code. */
        batchCode: z.string().trim().min(1).max(60).optional(),
        /** Last good day of a new batch; the product's shelf life decides when left out. */
        expiresOn: isoDate.optional(),
        /** What the supplier actually charged per whole unit; the order's cost when left out. */
        unitCostMinor: money.optional(),
      }),
    )
    .min(1)
    .max(500),
});
export type GoodsInBody = z.output<typeof goodsInBody>;
