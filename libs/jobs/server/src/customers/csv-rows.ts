import Papa from 'papaparse';
import type { CsvRows, RowError } from '@latchwork/jobs-domain';

/** What papaparse adds for cells beyond the headings. */
const EXTRA = '__parsed_extra';

/**
 * Reads CSV text into heading → cell rows (papaparse, `header: true`, delimiter guessed so
 * a semicolon file from a European spreadsheet reads too). Rows keep their positions, so
 * row numbers stay those of the spreadsheet (header = row 1); blank lines are left for the
 * import rules, which skip them. A row with more cells than headings, or an unclosed quote,
 * is an error of that row: its cells cannot be trusted to sit under the right headings.
 */
export function readCsv(csv: string): { rows: CsvRows; errors: RowError[] } {
  const parsed = Papa.parse<Record<string, string | string[] | undefined>>(csv, {
    header: true,
  });
  const errors: RowError[] = [];
  for (const e of parsed.errors) {
    if (e.type === 'Delimiter' || e.code === 'TooFewFields' || e.row === undefined) continue;
    const message =
      e.code === 'TooManyFields'
        ? 'More cells than headings: is a comma missing its quotes?'
        : `The file cannot be read here: ${e.message}.`;
    errors.push({ row: e.row + 2, column: '', message });
  }
  const rows = parsed.data.map((raw) => {
    const { [EXTRA]: _extra, ...cells } = raw;
    return cells as Record<string, string | undefined>;
  });
  return { rows, errors };
}
