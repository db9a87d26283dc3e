/** Request schemas of stock counts: start, the blind sheet's entries, reasons, the report. */
import { z } from 'zod';
import { packQuantity } from '../purchasing/product-facts';

export const COUNT_REASONS = [
  'miscount',
  'damaged',
  'lost',
  'unrecorded_issue',
  'unrecorded_receipt',
  'wrong_location',
  'other',
] as const;

export const countIdParams = z.object({ countId: z.uuid() });

export const startCountBody = z.object({
  locationId: z.uuid(),
  /** The products to count; left out (or empty), everything the location holds. */
  productIds: z.array(z.uuid()).max(2000).default([]),
  note: z.string().trim().max(500).default(''),
});
export type StartCountBody = z.output<typeof startCountBody>;

export const countQuery = z.object({
  status: z.enum(['counting', 'submitted', 'posted', 'cancelled']).optional(),
  locationId: z.uuid().optional(),
  limit: z.coerce.number().int().min(1).max(200).default(50),
});

/** What the counter found on a line: whole packs plus loose units. */
export const countEntriesBody = z.object({
  lines: z
    .array(z.object({ lineId: z.uuid(), ...packQuantity }))
    .min(1)
    .max(2000),
});
export type CountEntriesBody = z.output<typeof countEntriesBody>;

/** Why a line differs, given at review. */
export const countReasonsBody = z.object({
  lines: z
    .array(
      z.object({
        lineId: z.uuid(),
        reason: z.enum(COUNT_REASONS),
        note: z.string().trim().max(500).default(''),
      }),
    )
    .min(1)
    .max(2000),
});
export type CountReasonsBody = z.output<typeof countReasonsBody>;

const isoDate = z.iso.date();

export const varianceReportQuery = z.object({
  groupBy: z.enum(['product', 'location', 'month']).default('product'),
  from: isoDate.optional(),
  to: isoDate.optional(),
  locationId: z.uuid().optional(),
  productId: z.uuid().optional(),
});
export type VarianceReportQuery = z.output<typeof varianceReportQuery>;
