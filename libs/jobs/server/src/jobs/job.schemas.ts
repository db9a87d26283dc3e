import { z } from 'zod';
import { isIsoDate, STAGES } from '@latchwork/jobs-domain';

/**
 * Request and response shapes of the job routes. Money is integer minor units of the firm's
 * currency (pence for GBP; ISO 4217 minor digits), sent and returned as a JSON integer in
 * fields ending `Minor` — never a decimal number. Calendar dates are 'YYYY-MM-DD' text;
 * instants (`surveyAt`, `movedAt`…) are ISO 8601 timestamps.
 */

export const stage = z.enum(STAGES);
export const jobIdParams = z.object({ jobId: z.uuid() });

const isoDate = z.string().refine(isIsoDate, 'a date written YYYY-MM-DD');
const minor = z.number().int().min(0).max(Number.MAX_SAFE_INTEGER);
const trimmed = (max: number) => z.string().trim().max(max);

/** Fields a person sets on a job; every one but title and customer may be left out. */
const jobFields = {
  title: trimmed(200).min(1, 'a job needs a title'),
  customerId: z.uuid(),
  siteId: z.uuid().nullish(),
  valueEstimateMinor: minor.nullish(),
  /** Where the enquiry came from: website, referral, returning customer… */
  source: trimmed(100).default(''),
  ownerUserId: z.uuid().nullish(),
  enquiryOn: isoDate.optional(),
  surveyAt: z.iso.datetime({ offset: true }).nullish(),
  quoteDueOn: isoDate.nullish(),
  installStartOn: isoDate.nullish(),
  installEndOn: isoDate.nullish(),
};

const installOrder = (v: { installStartOn?: string | null; installEndOn?: string | null }) =>
  !v.installStartOn || !v.installEndOn || v.installStartOn <= v.installEndOn;
const installOrderProblem = {
  message: 'the install cannot end before it starts',
  path: ['installEndOn'],
};

export const createJobBody = z.object(jobFields).refine(installOrder, installOrderProblem);
export type CreateJobBody = z.output<typeof createJobBody>;

export const updateJobBody = z
  .object({ ...jobFields, source: trimmed(100) })
  .partial()
  .refine(installOrder, installOrderProblem);
export type UpdateJobBody = z.output<typeof updateJobBody>;

export const moveBody = z.object({ to: stage, reason: trimmed(500).nullish() });

export const noteBody = z.object({ body: trimmed(10_000).min(1, 'write something first') });

/** A comma-separated list in a query string (`owner=a,b`), as an array. */
const csvList = <T extends z.ZodType<unknown, string>>(item: T) =>
  z
    .string()
    .transform((s) => s.split(',').filter(Boolean))
    .pipe(z.array(item).max(100))
    .optional();

/** The dates a job can be filtered on. */
export const DATE_FIELDS = [
  'enquiryOn',
  'surveyAt',
  'quoteDueOn',
  'installStartOn',
  'stageChangedAt',
] as const;
export type DateField = (typeof DATE_FIELDS)[number];

/** The board's and the table's filters; the export takes them too. */
export const jobFilterQuery = z.object({
  /** Owner ids; `none` stands for jobs nobody owns. */
  owner: csvList(z.union([z.uuid(), z.literal('none')])),
  customer: csvList(z.uuid()),
  stage: csvList(stage),
  dateField: z.enum(DATE_FIELDS).default('enquiryOn'),
  from: isoDate.optional(),
  to: isoDate.optional(),
  minValue: z.coerce.number().pipe(minor).optional(),
  maxValue: z.coerce.number().pipe(minor).optional(),
  /** Words of the reference, title or customer name. */
  q: trimmed(100).optional(),
});
export type JobFilter = z.output<typeof jobFilterQuery>;

export const SORTS = [
  'reference',
  'title',
  'customer',
  'stage',
  'value',
  'owner',
  'enquiryOn',
  'stageChangedAt',
  'installStartOn',
] as const;
export type JobSort = (typeof SORTS)[number];

export const listQuery = jobFilterQuery.extend({
  sort: z.enum(SORTS).default('reference'),
  dir: z.enum(['asc', 'desc']).default('desc'),
  page: z.coerce.number().int().min(1).max(100_000).default(1),
  pageSize: z.coerce.number().int().min(1).max(200).default(25),
});
export type ListQuery = z.output<typeof listQuery>;

/** Cards per column on the board; `column` + `offset` fetch more of one column. */
export const boardQuery = jobFilterQuery.extend({
  column: stage.optional(),
  offset: z.coerce.number().int().min(0).max(100_000).default(0),
  limit: z.coerce.number().int().min(1).max(100).default(30),
});
export type BoardQuery = z.output<typeof boardQuery>;

export const timelineQuery = z.object({
  /** The id of the last event of the previous page: the page continues after it. */
  before: z.uuid().optional(),
  limit: z.coerce.number().int().min(1).max(100).default(30),
});
