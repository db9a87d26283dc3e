import { z } from 'zod';

export const reserveBody = z.object({
  jobId: z.uuid(),
  productId: z.uuid(),
  /** In stock steps; checked by the service so a fraction is named, not just refused. */
  quantity: z.number(),
  /** Reserve from one location only (else from the whole firm). */
  locationId: z.uuid().nullable().optional(),
  /** Reserve this batch (else the batch choice picks one). */
  batchId: z.uuid().nullable().optional(),
  /** Reserve the offered split over several batches when no single batch covers it. */
  acceptSplit: z.boolean().default(false),
  /** Reserve what there is when there is not enough. */
  acceptShort: z.boolean().default(false),
  note: z.string().trim().max(500).default(''),
});
export type ReserveBody = z.output<typeof reserveBody>;

export const reservationQuery = z.object({
  jobId: z.uuid().optional(),
  productId: z.uuid().optional(),
  status: z.enum(['active', 'fulfilled', 'released', 'all']).default('active'),
});

export const issueReservedBody = z.object({
  /** Steps to issue now; the rest of the reservation if left out. */
  quantity: z.number().optional(),
  /** Take from this location only (a van on its way to the site). */
  fromLocationId: z.uuid().nullable().optional(),
  note: z.string().trim().max(500).default(''),
});

export const reservationIdParams = z.object({ reservationId: z.uuid() });
export const jobIdParams = z.object({ jobId: z.uuid() });
