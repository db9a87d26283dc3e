import { z } from 'zod';

/**
 * Request and response shapes of the customer and site routes. Money is integer minor units
 * of the firm's currency (pence for GBP, cents for EUR; ISO 4217 minor digits), sent and
 * returned as a JSON integer in fields ending `Minor` — never a decimal number.
 */

const MONEY =
  'Money as a JSON integer of minor units of the firm’s currency (ISO 4217 minor digits: ' +
  '250000 is £2,500.00 in GBP, ¥250,000 in JPY); never a decimal. Null when not set.';

const trimmed = (max: number) => z.string().trim().max(max);
/** Optional text that may be cleared: empty text is stored as null. */
const optionalText = (max: number) =>
  trimmed(max)
    .nullish()
    .transform((v) => (v ? v : null));
/** Address lines as typed; blank lines (a form's empty second line) are dropped. */
const addressLines = z
  .array(trimmed(200))
  .max(6, 'at most 6 address lines')
  .transform((lines) => lines.filter((l) => l.length > 0));

export const customerKind = z.enum(['business', 'homeowner']);
export const customerIdParams = z.object({ customerId: z.uuid() });
export const siteIdParams = z.object({ siteId: z.uuid() });

export const listQuery = z.object({
  q: trimmed(100).optional(),
  sort: z.enum(['name', 'createdAt', 'postcode']).default('name'),
  dir: z.enum(['asc', 'desc']).default('asc'),
  page: z.coerce.number().int().min(1).max(100_000).default(1),
  pageSize: z.coerce.number().int().min(1).max(200).default(25),
});
export type ListQuery = z.output<typeof listQuery>;

export const customerListItem = z.object({
  id: z.string(),
  kind: customerKind,
  name: z.string(),
  email: z.string().nullable(),
  phone: z.string().nullable(),
  postcode: z.string().nullable(),
  externalRef: z.string().nullable(),
  siteCount: z.number().int(),
  /** Jobs not lost, paid or cancelled. */
  openJobCount: z.number().int(),
});
export const customerList = z.object({ items: z.array(customerListItem), total: z.number() });

export const siteSummary = z.object({
  id: z.string(),
  name: z.string(),
  addressLines: z.array(z.string()),
  postcode: z.string().nullable(),
});

/** An e-mail address that may be cleared: empty text is stored as null. */
const optionalEmail = z.preprocess(
  (v) => (v === '' ? null : v),
  z.email('not an e-mail address').max(254).toLowerCase().nullish(),
);
/** Postcodes are stored upper case with single spaces, as the import stores them. */
const optionalPostcode = optionalText(16).transform(
  (v) => v?.toUpperCase().replace(/\s+/g, ' ') ?? null,
);

/*
 * No `.default()` in these: a PATCH is the same schema made partial, and a default would
 * overwrite a field the caller did not send. The database supplies the defaults on insert.
 */
export const contactInput = z.object({
  /** Sent back for a contact already on file, so its id stays valid. */
  id: z.uuid().optional(),
  name: trimmed(200).min(1, 'a contact needs a name'),
  role: trimmed(100).optional(),
  email: optionalEmail,
  phone: optionalText(40),
});
export type ContactInput = z.output<typeof contactInput>;

export const customerInput = z.object({
  kind: customerKind,
  name: trimmed(200).min(1, 'a customer needs a name'),
  externalRef: optionalText(60),
  email: optionalEmail,
  phone: optionalText(40),
  billingAddressLines: addressLines.optional(),
  postcode: optionalPostcode,
  /** Overrides the firm's payment terms; null uses the firm's. */
  paymentTermsDays: z.number().int().min(0).max(365).nullish(),
  /** Integer minor units of the firm's currency, e.g. 250000 for £2,500.00 (GBP has 2 digits). */
  creditLimitMinor: z.number().int().min(0).max(Number.MAX_SAFE_INTEGER).nullish().describe(MONEY),
  notes: trimmed(4000).optional(),
  contacts: z.array(contactInput).max(20, 'at most 20 contacts').optional(),
});
export type CustomerInput = z.output<typeof customerInput>;
export const customerPatch = customerInput.partial();
export type CustomerPatch = z.output<typeof customerPatch>;

export const siteInput = z.object({
  name: trimmed(200).optional(),
  externalRef: optionalText(60),
  addressLines: addressLines.refine((l) => l.length > 0, 'a site needs its first address line'),
  postcode: optionalPostcode,
  accessNotes: trimmed(2000).optional(),
  parking: trimmed(500).optional(),
  floorType: trimmed(100).optional(),
  openingHours: trimmed(200).optional(),
});
export type SiteInput = z.output<typeof siteInput>;
export const sitePatch = siteInput.partial();
export type SitePatch = z.output<typeof sitePatch>;

export const site = siteSummary.extend({
  customerId: z.string(),
  externalRef: z.string().nullable(),
  accessNotes: z.string(),
  parking: z.string(),
  floorType: z.string(),
  openingHours: z.string(),
});

export const contact = z.object({
  id: z.string(),
  name: z.string(),
  role: z.string(),
  email: z.string().nullable(),
  phone: z.string().nullable(),
});

export const jobSummary = z.object({
  id: z.string(),
  reference: z.string(),
  title: z.string(),
  stage: z.string(),
  valueEstimateMinor: z.number().int().nullable().describe(MONEY),
  stageChangedAt: z.date(),
});

export const customerDetail = customerListItem
  .omit({ siteCount: true, openJobCount: true })
  .extend({
    billingAddressLines: z.array(z.string()),
    paymentTermsDays: z.number().int().nullable(),
    creditLimitMinor: z.number().int().nullable().describe(MONEY),
    notes: z.string(),
    createdAt: z.date(),
    updatedAt: z.date(),
    contacts: z.array(contact),
    sites: z.array(site),
    jobs: z.array(jobSummary),
    /** What the customer owes; filled by the invoicing issue, null until then. */
    balance: z.null(),
    /** The firm's currency and its minor digits, to show the money fields. */
    currency: z.string(),
    minorDigits: z.number().int(),
  });
