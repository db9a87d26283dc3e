/**
 * Request schemas of the ledger. Quantities and costs are taken as plain numbers so that a
 * fractional or negative quantity reaches the stock domain's checks and comes back as a 400
 * that says why ("must be counted in whole units"), naming the field.
 */
import { z } from 'zod';
import { batchDates } from '../places/places.schemas';

export const MOVEMENT_KINDS = [
  'receipt',
  'transfer',
  'issue',
  'return',
  'adjustment',
  'count_correction',
  'write_off',
] as const;

const id = z.uuid().nullable().optional();

export const movementBody = z.object({
  kind: z.enum(MOVEMENT_KINDS),
  productId: z.uuid(),
  batchId: id,
  /** A receipt may create its batch in the same step (goods in with a new batch code). */
  newBatch: batchDates.optional(),
  fromLocationId: id,
  toLocationId: id,
  quantity: z.number(),
  unitCostMinor: z.number().optional(),
  jobId: id,
  reservationId: id,
  writeOffReason: z.enum(['damaged', 'expired', 'lost']).nullable().optional(),
  note: z.string().max(500).optional(),
  /** The owner's reason for issuing an expired batch; audit-logged. */
  overrideExpiredReason: z.string().trim().max(500).nullable().optional(),
});
export type MovementBody = z.output<typeof movementBody>;

export const movementQuery = z.object({
  productId: z.uuid().optional(),
  locationId: z.uuid().optional(),
  batchId: z.uuid().optional(),
  jobId: z.uuid().optional(),
  kind: z.enum(MOVEMENT_KINDS).optional(),
  /** Ledger order (`seq`): only movements before this one, for paging back in time. */
  beforeSeq: z.coerce.number().int().min(1).optional(),
  limit: z.coerce.number().int().min(1).max(500).default(100),
});

export const balanceQuery = z.object({
  productId: z.uuid().optional(),
  locationId: z.uuid().optional(),
  kind: z.string().max(30).optional(),
  includeZero: z.enum(['true', 'false']).default('false'),
});

export const reverseBody = z.object({ note: z.string().trim().max(500).default('') });
export const movementIdParams = z.object({ movementId: z.uuid() });

export const settingsBody = z.object({
  allowNegativeStock: z.boolean(),
  expiryWarningDays: z.number().int().min(1).max(365),
  defaultServiceLevelBp: z.number().int().min(5000).max(9999),
  holdingCostRateBp: z.number().int().min(1).max(10000),
});
