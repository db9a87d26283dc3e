import { sql } from 'kysely';
import Papa from 'papaparse';
import { z } from 'zod';
import { withTenant, type TenantScope, type Tx } from '@latchwork/shared-db';
import {
  actorOf,
  endpoint,
  scopeOf,
  ValidationError,
  type EndpointDef,
} from '@latchwork/shared-server-kit';
import type { CsvRows, RowError } from '@latchwork/jobs-domain';
import type { JobsDeps } from '../jobs-deps';
import { applyCustomerChanges, planCustomerImport } from './customer-import';
import { auditCustomerChange, firmCurrency } from './customer-rules';
import { applySiteChanges, planSiteImport } from './site-import';

/** What papaparse adds for cells beyond the headings. */
const EXTRA = '__parsed_extra';

/**
 * Reads CSV text into heading → cell rows (papaparse, `header: true`, delimiter guessed so
 * a semicolon file from a European spreadsheet reads too). Rows keep their positions, so
 * row numbers stay those of the spreadsheet (header = row 1); blank lines are left for the
 * import rules, which skip them. A row with more cells than headings, or an unclosed quote,
 * is an error of that row: its cells cannot be trusted to sit under the right headings.
 */
function readCsv(csv: string): { rows: CsvRows; errors: RowError[] } {
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

/**
 * The API's JSON body limit is 1 MB, so the CSV text is capped just under it: thousands of
 * rows, enough to move a firm's customer list from a spreadsheet.
 */
const importBody = z.object({
  kind: z.enum(['customers', 'sites']),
  csv: z.string().min(1, 'the file is empty').max(950_000, 'at most about 1 MB of CSV'),
});
type ImportBody = z.output<typeof importBody>;

const rowError = z.object({ row: z.number(), column: z.string(), message: z.string() });
const counts = z.object({
  create: z.number(),
  update: z.number(),
  unchanged: z.number(),
  error: z.number(),
});
const preview = z.object({
  kind: z.enum(['customers', 'sites']),
  rows: z.array(
    z.object({
      row: z.number(),
      action: z.enum(['create', 'update', 'unchanged', 'error']),
      label: z.string(),
    }),
  ),
  errors: z.array(rowError),
  counts,
  unknownColumns: z.array(z.string()),
});

async function plan(tx: Tx, scope: TenantScope, body: ImportBody) {
  const { rows, errors } = readCsv(body.csv);
  if (body.kind === 'sites') {
    const planned = await planSiteImport(tx, scope, rows, errors);
    return { ...planned, apply: () => applySiteChanges(tx, scope, planned.changes) };
  }
  const { minorDigits } = await firmCurrency(tx, scope);
  const planned = await planCustomerImport(tx, scope, rows, errors, minorDigits);
  return {
    ...planned,
    apply: (userId: string) => applyCustomerChanges(tx, scope, planned.changes, userId),
  };
}

/**
 * CSV import of customers or sites: a preview that writes nothing, and a commit that plans
 * again inside its transaction (the firm's data may have changed since the preview) and
 * writes only when no row has an error.
 */
export function importEndpoints(deps: JobsDeps): EndpointDef[] {
  return [
    endpoint({
      method: 'post',
      path: '/customers/import/preview',
      summary: 'What importing a customers or sites CSV would do, row by row (writes nothing)',
      tags: ['customers'],
      permission: 'customers:write',
      body: importBody,
      response: preview,
      handle: ({ body, req }) =>
        withTenant(deps.db, scopeOf(req), async (tx) => {
          const { rows, errors, counts, unknownColumns } = await plan(tx, scopeOf(req), body);
          return { kind: body.kind, rows, errors, counts, unknownColumns };
        }),
    }),
    endpoint({
      method: 'post',
      path: '/customers/import/commit',
      summary:
        'Import a customers or sites CSV in one transaction; refused (400) if any row has an error',
      tags: ['customers'],
      permission: 'customers:write',
      body: importBody,
      response: z.object({ kind: z.enum(['customers', 'sites']), counts }),
      handle: ({ body, req }) =>
        withTenant(deps.db, scopeOf(req), async (tx) => {
          const scope = scopeOf(req);
          // One import at a time per firm, so two people importing one file create it once.
          await sql`select pg_advisory_xact_lock(hashtext(${`customer-import:${scope.tenantId}`}))`.execute(
            tx,
          );
          const planned = await plan(tx, scope, body);
          if (planned.errors.length) {
            const problems = planned.errors.map((e) => ({
              path: `rows.${e.row}${e.column ? `.${e.column}` : ''}`,
              message: e.message,
            }));
            throw new ValidationError(
              `${planned.counts.error} row${planned.counts.error === 1 ? ' has' : 's have'} errors: nothing was imported.`,
              problems,
            );
          }
          await planned.apply(actorOf(req).userId);
          await auditCustomerChange(tx, scope, req, 'customers-imported', body.kind, {
            ...planned.counts,
          });
          return { kind: body.kind, counts: planned.counts };
        }),
    }),
  ];
}
