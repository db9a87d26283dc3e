/**
 * Request schemas of the catalogue: products and suppliers. Money is integer minor units and
 * quantities integer steps of the stock unit, in the API as everywhere; the page converts
 * decimal text with the domain's parseMoney/parseQuantity and never sends a float.
 */
import { z } from 'zod';
import { PRODUCT_KINDS } from '@latchwork/stock-domain';

/** The largest money or quantity the API takes: safe integers with room for sums. */
export const MAX_AMOUNT = 1e13;

const money = z.number().int().min(0).max(MAX_AMOUNT);
const name = (max: number) => z.string().trim().min(1).max(max);
const noun = name(30);

export const productBody = z.object({
  sku: name(60),
  name: name(200),
  kind: z.enum(PRODUCT_KINDS),
  attributes: z.record(z.string(), z.union([z.string().max(60), z.number()])).default({}),
  unitOne: noun.default('unit'),
  unitOther: noun.default('units'),
  decimals: z.number().int().min(0).max(3).default(0),
  packOne: noun.default('pack'),
  packOther: noun.default('packs'),
  /** Steps per pack: 24 for a box of 24 tiles. */
  packSize: z.number().int().min(1).max(MAX_AMOUNT).default(1),
  kitComponents: z
    .array(z.object({ productId: z.uuid(), quantity: z.number().int().min(1).max(MAX_AMOUNT) }))
    .max(10)
    .default([]),
  costMinor: money.default(0),
  priceMinor: money.default(0),
  taxRateBp: z.number().int().min(0).max(10000).default(2000),
  preferredSupplierId: z.uuid().nullable().default(null),
  serviceLevelBp: z.number().int().min(5000).max(9999).nullable().default(null),
  leadTimeDays: z.number().int().min(0).max(365).nullable().default(null),
  minOrderQuantity: z.number().int().min(1).max(MAX_AMOUNT).nullable().default(null),
  roundToPacks: z.boolean().default(true),
  shelfLifeDays: z.number().int().min(1).max(36500).nullable().default(null),
  active: z.boolean().default(true),
});
export type ProductBody = z.output<typeof productBody>;

export const productQuery = z.object({
  q: z.string().trim().max(100).optional(),
  kind: z.enum(PRODUCT_KINDS).optional(),
  active: z.enum(['true', 'false', 'all']).default('true'),
  limit: z.coerce.number().int().min(1).max(500).default(100),
  offset: z.coerce.number().int().min(0).default(0),
});

const contact = z.object({
  name: name(200),
  role: z.string().trim().max(100).optional(),
  email: z.email().max(320).optional(),
  phone: z.string().trim().max(40).optional(),
});

export const supplierBody = z.object({
  name: name(200),
  email: z.email().max(320).toLowerCase().nullable().default(null),
  phone: z.string().trim().max(40).nullable().default(null),
  accountRef: z.string().trim().max(60).nullable().default(null),
  addressLines: z.array(z.string().trim().max(200)).max(6).default([]),
  contacts: z.array(contact).max(20).default([]),
  leadTimeDays: z.number().int().min(0).max(365).default(7),
  orderCostMinor: money.nullable().default(null),
  notes: z.string().max(2000).default(''),
  active: z.boolean().default(true),
});
export type SupplierBody = z.output<typeof supplierBody>;

export const productIdParams = z.object({ productId: z.uuid() });
export const supplierIdParams = z.object({ supplierId: z.uuid() });
