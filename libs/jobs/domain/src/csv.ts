/**
 * CSV writing per RFC 4180: fields with a comma, a double quote, CR or LF are quoted, quotes
 * inside are doubled, records end with CRLF.
 */

export type CsvCell = string | number | null | undefined;

// A spreadsheet runs a cell that starts with one of these as a formula (OWASP "CSV
// injection"). Plain numbers such as "-12.50" are left alone: they are data, not formulas.
const FORMULA_START = /^[=+\-@\t\r]/;
const PLAIN_NUMBER = /^[-+]?\d+(\.\d+)?$/;

/** Options for writing. `guardFormulas` (default true) prefixes risky text with `'`. */
export interface CsvOptions {
  readonly guardFormulas?: boolean;
}

/** One field as RFC 4180 text. null and undefined become an empty field. */
export function csvField(value: CsvCell, options: CsvOptions = {}): string {
  if (value === null || value === undefined) return '';
  let text: string;
  if (typeof value === 'number') {
    if (!Number.isFinite(value)) throw new RangeError(`Cannot write ${value} to CSV.`);
    text = String(value);
  } else {
    text = value;
    if ((options.guardFormulas ?? true) && FORMULA_START.test(text) && !PLAIN_NUMBER.test(text)) {
      text = `'${text}`;
    }
  }
  return /[",\r\n]/.test(text) ? `"${text.replaceAll('"', '""')}"` : text;
}

/** One record without its line break. */
export function csvRow(values: readonly CsvCell[], options: CsvOptions = {}): string {
  return values.map((v) => csvField(v, options)).join(',');
}

/**
 * A whole file: every record followed by CRLF. `bom` adds a UTF-8 byte-order mark, which
 * spreadsheet programs need to read accented names correctly.
 */
export function csvDocument(
  rows: readonly (readonly CsvCell[])[],
  options: CsvOptions & { readonly bom?: boolean } = {},
): string {
  const body = rows.map((r) => `${csvRow(r, options)}\r\n`).join('');
  return options.bom ? `\uFEFF${body}` : body;
}
