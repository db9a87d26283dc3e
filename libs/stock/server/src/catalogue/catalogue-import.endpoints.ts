/**
 * CSV import and export of the catalogue. Import is two steps: the preview parses and checks
 * every row (row, column, why) and says what each would do — nothing is written; confirm
 * runs the same checks again and writes all rows in one transaction, or nothing.
 */
import { z } from 'zod';
import type { TenantScope, Tx } from '@latchwork/shared-db';
import { endpoint, ValidationError } from '@latchwork/shared-server-kit';
import { attributeProblems } from '@latchwork/stock-domain';
import type { StockDeps } from '../stock-deps';
import { inFirm } from '../stock-tx';
import { catalogueCsv, currencyDigits, parseCatalogueCsv, type RowProblem } from './catalogue-csv';
import { insertProduct, updateProduct } from './product.repository';

const importBody = z.object({ csv: z.string().min(1).max(900_000) });

async function firmDigits(tx: Tx, scope: TenantScope): Promise<number> {
  const t = await tx
    .selectFrom('tenant')
    .select('currency')
    .where('id', '=', scope.tenantId)
    .executeTakeFirstOrThrow();
  return currencyDigits(t.currency);
}

/** Parses and checks the file against the firm's catalogue and suppliers. */
async function plan(tx: Tx, scope: TenantScope, csv: string) {
  const { rows, fileProblems } = parseCatalogueCsv(csv, await firmDigits(tx, scope));
  const [products, suppliers] = await Promise.all([
    tx.selectFrom('product').select(['id', 'sku']).where('tenantId', '=', scope.tenantId).execute(),
    tx
      .selectFrom('supplier')
      .select(['id', 'name'])
      .where('tenantId', '=', scope.tenantId)
      .execute(),
  ]);
  const bySku = new Map(products.map((p) => [p.sku, p.id]));
  const supplierId = new Map(suppliers.map((s) => [s.name.toLowerCase(), s.id]));
  const planned = rows.map((r) => {
    const problems: RowProblem[] = [...r.problems];
    if (r.body)
      for (const p of attributeProblems(r.body.kind, r.body.attributes))
        problems.push({
          row: r.row,
          column: p.field.replace('attributes.', ''),
          message: p.message,
        });
    const sid = r.supplierName ? supplierId.get(r.supplierName.toLowerCase()) : null;
    if (r.supplierName && !sid)
      problems.push({
        row: r.row,
        column: 'preferred_supplier',
        message: `no supplier called ${r.supplierName}`,
      });
    const body =
      r.body && problems.length === 0 ? { ...r.body, preferredSupplierId: sid ?? null } : null;
    const existing = r.body ? bySku.get(r.body.sku) : undefined;
    return {
      row: r.row,
      sku: r.body?.sku ?? null,
      action:
        problems.length > 0
          ? ('error' as const)
          : existing
            ? ('update' as const)
            : ('create' as const),
      existingId: existing ?? null,
      body,
      problems,
    };
  });
  const problems = [...fileProblems, ...planned.flatMap((p) => p.problems)];
  return { planned, problems };
}

const summaryOf = (planned: Awaited<ReturnType<typeof plan>>['planned']) => ({
  create: planned.filter((p) => p.action === 'create').length,
  update: planned.filter((p) => p.action === 'update').length,
  error: planned.filter((p) => p.action === 'error').length,
});

/** Catalogue CSV: export, import preview, import confirm. */
export function catalogueImportEndpoints(deps: StockDeps) {
  return [
    endpoint({
      method: 'get',
      path: '/stock/products/export.csv',
      summary: 'The catalogue as CSV (the import’s columns)',
      tags: ['stock'],
      permission: 'stock:read',
      async handle({ req, res }) {
        const csv = await inFirm(deps.db, req, async (tx, scope) => {
          const rows = await tx
            .selectFrom('product as p')
            .leftJoin('supplier as s', (j) =>
              j.onRef('s.id', '=', 'p.preferredSupplierId').on('s.tenantId', '=', scope.tenantId),
            )
            .selectAll('p')
            .select('s.name as supplierName')
            .where('p.tenantId', '=', scope.tenantId)
            .orderBy('p.kind')
            .orderBy('p.sku')
            .execute();
          return catalogueCsv(
            rows.map((r) => ({
              product: {
                ...r,
                packSize: Number(r.packSize),
                costMinor: Number(r.costMinor),
                priceMinor: Number(r.priceMinor),
                minOrderQuantity: r.minOrderQuantity === null ? null : Number(r.minOrderQuantity),
                attributes: r.attributes as Record<string, string | number>,
              },
              supplierName: r.supplierName,
            })),
            await firmDigits(tx, scope),
          );
        });
        res.setHeader('Content-Type', 'text/csv; charset=utf-8');
        res.setHeader('Content-Disposition', 'attachment; filename="catalogue.csv"');
        res.send(csv);
      },
    }),
    endpoint({
      method: 'post',
      path: '/stock/products/import/preview',
      summary: 'Check a catalogue CSV: per-row problems and what each row would do (nothing saved)',
      tags: ['stock'],
      permission: 'stock:write',
      body: importBody,
      handle: ({ body, req }) =>
        inFirm(deps.db, req, async (tx, scope) => {
          const { planned, problems } = await plan(tx, scope, body.csv);
          return {
            summary: summaryOf(planned),
            rows: planned.map(({ body: _b, existingId: _e, ...p }) => p),
            problems,
          };
        }),
    }),
    endpoint({
      method: 'post',
      path: '/stock/products/import',
      summary: 'Import a checked catalogue CSV: every row or none',
      tags: ['stock'],
      permission: 'stock:write',
      body: importBody,
      handle: ({ body, req }) =>
        inFirm(deps.db, req, async (tx, scope) => {
          const { planned, problems } = await plan(tx, scope, body.csv);
          if (problems.length > 0)
            throw new ValidationError(
              `${problems.length} problems in the file; nothing was imported.`,
              problems.map((p) => ({ path: `row ${p.row}.${p.column}`, ...p })),
            );
          for (const p of planned) {
            if (!p.body) continue;
            if (p.existingId) await updateProduct(tx, scope, p.existingId, p.body);
            else await insertProduct(tx, scope, p.body);
          }
          return { summary: summaryOf(planned) };
        }),
    }),
  ];
}
