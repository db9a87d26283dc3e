/** Request schemas of stock locations and batches. */
import { z } from 'zod';

const isoDate = z.iso.date();

export const locationBody = z.object({
  name: z.string().trim().min(1).max(120),
  kind: z.enum(['warehouse', 'van', 'site']),
  /** A site location may belong to a job, or to a customer's site. */
  jobId: z.uuid().nullable().default(null),
  siteId: z.uuid().nullable().default(null),
  notes: z.string().max(2000).default(''),
  active: z.boolean().default(true),
});
export type LocationBody = z.output<typeof locationBody>;

/** A batch's dates: the expiry is the last good day and cannot come before receipt. */
export const batchDates = z
  .object({
    code: z.string().trim().min(1).max(60),
    receivedOn: isoDate,
    expiresOn: isoDate.nullable().optional(),
    supplierId: z.uuid().nullable().default(null),
  })
  .superRefine((b, ctx) => {
    if (b.expiresOn && b.expiresOn < b.receivedOn)
      ctx.addIssue({
        code: 'custom',
        path: ['expiresOn'],
        message: `the expiry date ${b.expiresOn} is before the date received ${b.receivedOn}`,
      });
  });

export const batchBody = z.object({ productId: z.uuid() }).and(batchDates);
export type BatchBody = z.output<typeof batchBody>;

export const batchQuery = z.object({
  productId: z.uuid().optional(),
  /** Only batches expiring within this many days (expired ones included). */
  expiringWithinDays: z.coerce.number().int().min(0).max(3650).optional(),
});

export const locationIdParams = z.object({ locationId: z.uuid() });
export const batchIdParams = z.object({ batchId: z.uuid() });
