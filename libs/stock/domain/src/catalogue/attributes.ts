/**
 * What the catalogue records about each kind of product beyond its name, cost and pack: the
 * API validates attributes against this table and the product form shows these fields for
 * the kind chosen. Lengths are whole millimetres and areas whole square millimetres (the
 * project's internal units); the page shows them in the firm's units.
 */
import { problem, type StockProblem } from '../problems';

/** Product kinds, as stored. */
export const PRODUCT_KINDS = [
  'tile',
  'ramp',
  'corner_piece',
  'skirting',
  'corner_trim',
  'adhesive',
  'hardener',
  'primer',
  'filler',
  'tape',
  'mastic',
  'hire_tool',
  'labour',
  'other',
] as const;
export type ProductKindId = (typeof PRODUCT_KINDS)[number];

/** One attribute: free text, a length in mm, or an area in mm². */
export interface AttributeField {
  key: string;
  label: string;
  type: 'text' | 'mm' | 'mm2';
}

const colour: AttributeField = { key: 'colour', label: 'Colour', type: 'text' };
const thickness: AttributeField = { key: 'thicknessMm', label: 'Thickness', type: 'mm' };
const length: AttributeField = { key: 'lengthMm', label: 'Stock length', type: 'mm' };
const coverage: AttributeField = {
  key: 'coverageMm2',
  label: 'Coverage per unit',
  type: 'mm2',
};

/** The attributes each kind records (every one optional). */
export const ATTRIBUTE_FIELDS: Record<ProductKindId, readonly AttributeField[]> = {
  tile: [
    colour,
    thickness,
    { key: 'finish', label: 'Finish', type: 'text' },
    { key: 'pitchMm', label: 'Laid pitch', type: 'mm' },
  ],
  ramp: [colour, thickness, length],
  corner_piece: [colour, thickness],
  skirting: [colour, length],
  corner_trim: [colour, length],
  adhesive: [coverage],
  hardener: [],
  primer: [coverage],
  filler: [coverage],
  tape: [length],
  mastic: [colour],
  hire_tool: [],
  labour: [],
  other: [colour],
};

/** Kinds whose stock is held in batches with an expiry date (shelf life matters). */
export const EXPIRING_KINDS: ReadonlySet<ProductKindId> = new Set([
  'adhesive',
  'hardener',
  'primer',
  'filler',
  'mastic',
]);

/** Every problem with `attributes` for `kind`, each naming `attributes.<key>`. */
export function attributeProblems(
  kind: ProductKindId,
  attributes: Record<string, unknown>,
): StockProblem[] {
  const fields = new Map(ATTRIBUTE_FIELDS[kind].map((f) => [f.key, f]));
  const out: StockProblem[] = [];
  for (const [key, value] of Object.entries(attributes)) {
    const field = fields.get(key);
    const path = `attributes.${key}`;
    if (!field) {
      out.push(problem(path, 'invalid-setting', `a ${kind} has no ${key}`));
    } else if (field.type === 'text') {
      if (typeof value !== 'string' || value.length > 60)
        out.push(problem(path, 'invalid-setting', 'must be text of at most 60 characters'));
    } else if (!Number.isSafeInteger(value) || (value as number) <= 0) {
      const unit = field.type === 'mm' ? 'millimetres' : 'square millimetres';
      out.push(problem(path, 'fractional-quantity', `must be a whole number of ${unit} above 0`));
    }
  }
  return out;
}
