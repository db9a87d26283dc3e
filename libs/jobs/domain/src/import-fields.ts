/**
 * The pieces of a CSV import validator: column specs, cell parsers and the row loop. The file
 * is parsed elsewhere (papaparse with `header: true`); rows arrive as objects of strings.
 */

/** A problem with one cell. `row` counts as a spreadsheet does: the header is row 1. */
export interface RowError {
  readonly row: number;
  readonly column: string;
  readonly message: string;
}

/** What a cell parser returns for a bad cell. */
export class CellError {
  constructor(readonly message: string) {}
}

/** A column the import understands: its heading, other headings people use, its parser. */
export interface ColumnSpec<T> {
  readonly heading: string;
  readonly aliases?: readonly string[];
  readonly required?: boolean;
  /** Gets the trimmed, non-empty cell text; empty cells become null without a call. */
  readonly parse: (text: string) => T | CellError;
}

export type ColumnSpecs = Readonly<Record<string, ColumnSpec<unknown>>>;

/** The record a set of specs produces: each value parsed, or null where the cell was empty. */
export type ParsedRecord<C extends ColumnSpecs> = {
  -readonly [K in keyof C]: C[K] extends ColumnSpec<infer T> ? T | null : never;
};

/** "E-mail Address", "email_address", " EMAIL-address " → "email address". */
export function normaliseHeading(heading: string): string {
  return heading
    .replace(/^\uFEFF/, '')
    .trim()
    .toLowerCase()
    .replace(/[\s_\-.]+/g, ' ')
    .replace(/e mail/g, 'email');
}

/** A text cell of at most `max` characters, inner runs of spaces kept (notes have them). */
export const text =
  (max: number) =>
  (t: string): string | CellError =>
    t.length <= max ? t : new CellError(`At most ${max} characters (this has ${t.length}).`);

/**
 * An e-mail address, lowercased so that matching ignores case. A pragmatic check (one "@",
 * a dot in the domain, no spaces) within RFC 5321's 254-character path limit; the real test
 * is the e-mail getting through.
 */
export function email(t: string): string | CellError {
  const v = t.toLowerCase();
  if (v.length > 254 || !/^[^\s@]+@[^\s@]+\.[^\s@.]+$/.test(v)) {
    return new CellError(`"${t}" is not an e-mail address.`);
  }
  return v;
}

/** A phone number as people write it: digits, spaces, + ( ) - . and 6–15 digits (ITU E.164). */
export function phone(t: string): string | CellError {
  const digits = t.replace(/\D/g, '').length;
  if (!/^[+\d\s().-]+$/.test(t) || digits < 6 || digits > 15) {
    return new CellError(`"${t}" is not a phone number.`);
  }
  return t.replace(/\s+/g, ' ');
}

/** A whole number within a range. */
export const wholeNumber =
  (min: number, max: number) =>
  (t: string): number | CellError => {
    const n = /^\d+$/.test(t) ? Number(t) : Number.NaN;
    return Number.isSafeInteger(n) && n >= min && n <= max
      ? n
      : new CellError(`A whole number from ${min} to ${max}.`);
  };

/** One of a few words, each with the spellings people use for it. */
export const oneOf =
  <T extends string>(words: Readonly<Record<string, T>>, hint: string) =>
  (t: string): T | CellError =>
    words[t.toLowerCase()] ?? new CellError(`Use ${hint}.`);

/** Postcodes compare without case or spacing differences ("ab1  2cd" = "AB1 2CD"). */
export function postcode(t: string): string | CellError {
  const v = t.toUpperCase().replace(/\s+/g, ' ');
  return v.length <= 16 ? v : new CellError('At most 16 characters.');
}

/** Rows as papaparse gives them with `header: true`: heading → cell text. */
export type CsvRows = readonly Readonly<Record<string, string | undefined>>[];

/** A validated import: good records with their row numbers, and every cell error. */
export interface ImportResult<R> {
  readonly records: { readonly row: number; readonly record: R }[];
  readonly errors: RowError[];
  /** Headings the import does not know; shown in the preview, their cells ignored. */
  readonly unknownColumns: string[];
}

/**
 * Parses every row by the specs: required cells, each parser, and one error per bad cell
 * (headed by the spec's heading, whatever the file called it). Rows with errors give no
 * record. Blank rows (every cell empty) are skipped, as spreadsheets leave them at the end.
 */
export function parseRows<C extends ColumnSpecs>(
  rows: CsvRows,
  specs: C,
): ImportResult<ParsedRecord<C>> {
  const lookup = new Map<string, keyof C>();
  for (const [key, spec] of Object.entries(specs)) {
    for (const h of [spec.heading, key, ...(spec.aliases ?? [])]) {
      lookup.set(normaliseHeading(h), key);
    }
  }
  const headings = [...new Set(rows.flatMap((r) => Object.keys(r)))];
  const columnOf = new Map<string, keyof C>();
  const unknownColumns: string[] = [];
  for (const h of headings) {
    const key = lookup.get(normaliseHeading(h));
    if (key === undefined) unknownColumns.push(h);
    else columnOf.set(h, key);
  }
  const records: { row: number; record: ParsedRecord<C> }[] = [];
  const errors: RowError[] = [];
  rows.forEach((raw, i) => {
    const row = i + 2;
    const cells = new Map<keyof C, string>();
    for (const [h, key] of columnOf) {
      const t = raw[h]?.trim();
      if (t) cells.set(key, t);
    }
    if (Object.values(raw).every((v) => !v?.trim())) return;
    const record: Record<string, unknown> = {};
    let ok = true;
    for (const [key, spec] of Object.entries(specs)) {
      const t = cells.get(key);
      const value = t === undefined ? null : spec.parse(t);
      if (value instanceof CellError || (value === null && spec.required)) {
        ok = false;
        const message = value instanceof CellError ? value.message : 'Required.';
        errors.push({ row, column: spec.heading, message });
      }
      record[key] = value;
    }
    if (ok) records.push({ row, record: record as ParsedRecord<C> });
  });
  return { records, errors, unknownColumns };
}
