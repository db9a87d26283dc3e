/**
 * The catalogue as CSV, one product a row: the same columns for export and import, so an
 * exported file re-imports unchanged. Money and quantities are decimal text ("2.50", never a
 * float) in the firm's currency digits and the product's stock unit; attributes by kind
 * have a column each; the preferred supplier is named, not referenced by id.
 */
import Papa from 'papaparse';
import {
  formatDecimal,
  formatMoney,
  formatQuantity,
  parseMoney,
  parseQuantity,
} from '@latchwork/stock-domain';
import { productBody, type ProductBody } from './catalogue.schemas';

/** Columns in file order. */
export const CSV_COLUMNS = [
  'sku',
  'name',
  'kind',
  'colour',
  'thickness_mm',
  'finish',
  'pitch_mm',
  'length_mm',
  'coverage_mm2',
  'unit_one',
  'unit_other',
  'decimals',
  'pack_one',
  'pack_other',
  'pack_size',
  'cost',
  'price',
  'tax_rate_percent',
  'preferred_supplier',
  'lead_time_days',
  'min_order_quantity',
  'shelf_life_days',
  'active',
] as const;
type Column = (typeof CSV_COLUMNS)[number];

const ATTRIBUTE_COLUMNS: [Column, string, 'text' | 'int'][] = [
  ['colour', 'colour', 'text'],
  ['thickness_mm', 'thicknessMm', 'int'],
  ['finish', 'finish', 'text'],
  ['pitch_mm', 'pitchMm', 'int'],
  ['length_mm', 'lengthMm', 'int'],
  ['coverage_mm2', 'coverageMm2', 'int'],
];

/** The minor digits of an ISO 4217 currency (2 for GBP, 0 for JPY, 3 for KWD), from ICU. */
export function currencyDigits(currency: string): number {
  return (
    new Intl.NumberFormat('en', { style: 'currency', currency }).resolvedOptions()
      .maximumFractionDigits ?? 2
  );
}

/** A product exported as a row of text cells. */
export interface ExportRow {
  product: ProductBody;
  supplierName: string | null;
}

/** The catalogue as RFC 4180 CSV; cells that a spreadsheet would run as formulas are escaped. */
export function catalogueCsv(rows: readonly ExportRow[], digits: number): string {
  const data = rows.map(({ product: p, supplierName }) => {
    const a = p.attributes;
    const cells: Record<Column, string> = {
      sku: p.sku,
      name: p.name,
      kind: p.kind,
      colour: '',
      thickness_mm: '',
      finish: '',
      pitch_mm: '',
      length_mm: '',
      coverage_mm2: '',
      unit_one: p.unitOne,
      unit_other: p.unitOther,
      decimals: String(p.decimals),
      pack_one: p.packOne,
      pack_other: p.packOther,
      pack_size: formatQuantity(p.packSize, p.decimals),
      cost: formatMoney(p.costMinor, digits),
      price: formatMoney(p.priceMinor, digits),
      tax_rate_percent: formatDecimal(p.taxRateBp, 2),
      preferred_supplier: supplierName ?? '',
      lead_time_days: p.leadTimeDays === null ? '' : String(p.leadTimeDays),
      min_order_quantity:
        p.minOrderQuantity === null ? '' : formatQuantity(p.minOrderQuantity, p.decimals),
      shelf_life_days: p.shelfLifeDays === null ? '' : String(p.shelfLifeDays),
      active: p.active ? 'yes' : 'no',
    };
    for (const [column, key] of ATTRIBUTE_COLUMNS)
      if (a[key] !== undefined) cells[column] = String(a[key]);
    return CSV_COLUMNS.map((c) => cells[c]);
  });
  return Papa.unparse(
    { fields: [...CSV_COLUMNS], data },
    { escapeFormulae: true, newline: '\r\n' },
  );
}

/** One problem of an imported row: the row number as a spreadsheet shows it, the column, why. */
export interface RowProblem {
  row: number;
  column: string;
  message: string;
}

/** A parsed row: the product body (without supplier id) and the supplier named. */
export interface ParsedRow {
  row: number;
  body: ProductBody | null;
  supplierName: string | null;
  problems: RowProblem[];
}

const number = (text: string, what: (v: string) => number) => (text === '' ? null : what(text));

/** Turns one CSV record into a product body, collecting every problem with its column. */
function parseRecord(record: Record<string, string>, row: number, digits: number): ParsedRow {
  const problems: RowProblem[] = [];
  const cell = (c: Column) => (record[c] ?? '').trim();
  const attempt = <T>(column: Column, read: () => T): T | undefined => {
    try {
      return read();
    } catch (err) {
      problems.push({ row, column, message: (err as Error).message });
      return undefined;
    }
  };
  const decimals =
    attempt('decimals', () => number(cell('decimals'), (v) => parseQuantity(v, 0))) ?? 0;
  const attributes: Record<string, string | number> = {};
  for (const [column, key, type] of ATTRIBUTE_COLUMNS) {
    const v = cell(column);
    if (v === '') continue;
    const value = type === 'text' ? v : attempt(column, () => parseQuantity(v, 0));
    if (value !== undefined) attributes[key] = value;
  }
  const active = cell('active').toLowerCase();
  if (!['', 'yes', 'no', 'true', 'false'].includes(active))
    problems.push({ row, column: 'active', message: 'write yes or no' });
  const candidate = {
    sku: cell('sku'),
    name: cell('name'),
    kind: cell('kind'),
    attributes,
    unitOne: cell('unit_one') || undefined,
    unitOther: cell('unit_other') || undefined,
    decimals,
    packOne: cell('pack_one') || undefined,
    packOther: cell('pack_other') || undefined,
    packSize:
      attempt('pack_size', () => number(cell('pack_size'), (v) => parseQuantity(v, decimals))) ??
      undefined,
    costMinor:
      attempt('cost', () => number(cell('cost'), (v) => parseMoney(v, digits))) ?? undefined,
    priceMinor:
      attempt('price', () => number(cell('price'), (v) => parseMoney(v, digits))) ?? undefined,
    taxRateBp:
      attempt('tax_rate_percent', () =>
        number(cell('tax_rate_percent'), (v) => parseQuantity(v, 2)),
      ) ?? undefined,
    leadTimeDays: attempt('lead_time_days', () =>
      number(cell('lead_time_days'), (v) => parseQuantity(v, 0)),
    ),
    minOrderQuantity: attempt('min_order_quantity', () =>
      number(cell('min_order_quantity'), (v) => parseQuantity(v, decimals)),
    ),
    shelfLifeDays: attempt('shelf_life_days', () =>
      number(cell('shelf_life_days'), (v) => parseQuantity(v, 0)),
    ),
    active: active === '' ? undefined : active === 'yes' || active === 'true',
  };
  const parsed = productBody.safeParse(candidate);
  if (!parsed.success)
    for (const issue of parsed.error.issues) {
      const column = COLUMN_OF[String(issue.path[0])] ?? String(issue.path.join('.'));
      if (!problems.some((p) => p.column === column))
        problems.push({ row, column, message: issue.message });
    }
  return {
    row,
    body: parsed.success && problems.length === 0 ? parsed.data : null,
    supplierName: cell('preferred_supplier') || null,
    problems,
  };
}

/** The body field each column feeds, reversed: which column to blame for a field's problem. */
const COLUMN_OF: Record<string, Column> = {
  sku: 'sku',
  name: 'name',
  kind: 'kind',
  unitOne: 'unit_one',
  unitOther: 'unit_other',
  decimals: 'decimals',
  packOne: 'pack_one',
  packOther: 'pack_other',
  packSize: 'pack_size',
  costMinor: 'cost',
  priceMinor: 'price',
  taxRateBp: 'tax_rate_percent',
  leadTimeDays: 'lead_time_days',
  minOrderQuantity: 'min_order_quantity',
  shelfLifeDays: 'shelf_life_days',
  active: 'active',
};

/** Parses a catalogue CSV; row numbers count the header as row 1, as a spreadsheet does. */
export function parseCatalogueCsv(
  text: string,
  digits: number,
): { rows: ParsedRow[]; fileProblems: RowProblem[] } {
  const result = Papa.parse<Record<string, string>>(text.replace(/^\uFEFF/, ''), {
    header: true,
    skipEmptyLines: 'greedy',
  });
  const fileProblems: RowProblem[] = [];
  const fields = result.meta.fields ?? [];
  for (const required of ['sku', 'name', 'kind'])
    if (!fields.includes(required))
      fileProblems.push({ row: 1, column: required, message: 'the header row lacks this column' });
  for (const f of fields)
    if (!(CSV_COLUMNS as readonly string[]).includes(f))
      fileProblems.push({ row: 1, column: f, message: 'unknown column' });
  for (const e of result.errors)
    fileProblems.push({ row: (e.row ?? 0) + 2, column: '', message: e.message });
  const rows = result.data.map((record, i) => parseRecord(record, i + 2, digits));
  const seen = new Map<string, number>();
  for (const r of rows) {
    const sku = r.body?.sku;
    if (!sku) continue;
    const first = seen.get(sku);
    if (first) {
      r.problems.push({ row: r.row, column: 'sku', message: `the same SKU as row ${first}` });
      r.body = null;
    } else seen.set(sku, r.row);
  }
  return { rows, fileProblems };
}
