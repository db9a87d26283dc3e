import type { TenantScope, Tx } from '@latchwork/shared-db';
import {
  customerKeys,
  siteCustomerKey,
  siteKeys,
  validateSiteRows,
  type CsvRows,
  type RowError,
  type SiteImportRecord,
} from '@latchwork/jobs-domain';
import { customersByKeys } from './customer-import';
import { siteColumns } from './site.repository';
import {
  planRows,
  type Change,
  type FileRow,
  type ImportKind,
  type OnFile,
} from './import-planner';

/** A site as the import reads and writes it. */
export interface SiteValues {
  customerId: string;
  name: string;
  externalRef: string | null;
  addressLines: string[];
  postcode: string | null;
  accessNotes: string;
  parking: string;
  floorType: string;
  openingHours: string;
}

type Row = SiteImportRecord & { customerId: string };

const present = <T>(v: T | null): v is T => v !== null;

/** Empty cells keep what is on file; the address lines are given as a whole (line 1 is required). */
const siteKind: ImportKind<Row, SiteValues> = {
  merge: (base, r) => ({
    customerId: r.customerId,
    name: r.name ?? base?.name ?? '',
    externalRef: r.externalRef ?? base?.externalRef ?? null,
    addressLines: [r.address1, r.address2, r.town, r.country].filter(present),
    postcode: r.postcode ?? base?.postcode ?? null,
    accessNotes: r.accessNotes ?? base?.accessNotes ?? '',
    parking: r.parking ?? base?.parking ?? '',
    floorType: r.floorType ?? base?.floorType ?? '',
    openingHours: r.openingHours ?? base?.openingHours ?? '',
  }),
  comparable: (v) => ({ ...v }),
  label: (r) => r.name ?? r.address1 ?? '',
  // Moving a site to another customer would leave its jobs with the wrong customer.
  refuse: (r, match) =>
    match.values.customerId === r.customerId
      ? null
      : 'This site reference belongs to a site of another customer.',
};

const keysOfSite = (s: SiteValues) =>
  siteKeys({ ...s, address1: s.addressLines[0] ?? null, customerId: s.customerId });

/**
 * Plans a sites file. Each row names its customer by reference or e-mail; a row whose
 * customer is not on file is an error (import the customers first). Sites on file are those
 * of the customers the file names, plus any whose reference the file uses.
 */
export async function planSiteImport(
  tx: Tx,
  scope: TenantScope,
  rows: CsvRows,
  csvErrors: readonly RowError[],
) {
  const result = validateSiteRows(rows);
  const badRows = new Set(csvErrors.map((e) => e.row));
  const records = result.records.filter((r) => !badRows.has(r.row));
  const emails = [...new Set(records.flatMap((r) => r.record.customerEmail ?? []))];
  const refs = [...new Set(records.flatMap((r) => r.record.customerRef ?? []))];
  const customers =
    emails.length || refs.length ? await customersByKeys(tx, scope, emails, refs) : [];
  const customerByKey = new Map(customers.flatMap((c) => customerKeys(c).map((k) => [k, c.id])));
  const errors: RowError[] = [...csvErrors, ...result.errors];
  const fileRows: FileRow<Row>[] = [];
  for (const { row, record } of records) {
    const customerId = customerByKey.get(siteCustomerKey(record));
    if (!customerId) {
      const byRef = record.customerRef !== null;
      errors.push({
        row,
        column: byRef ? 'Customer reference' : 'Customer email',
        message: `No customer with ${byRef ? `reference "${record.customerRef}"` : `e-mail ${record.customerEmail}`} on file: import the customers first.`,
      });
      continue;
    }
    const full = { ...record, customerId };
    fileRows.push({ row, record: full, keys: siteKeys(full) });
  }
  const onFile = await sitesOnFile(tx, scope, fileRows);
  const plan = planRows(siteKind, fileRows, onFile, errors);
  return { ...plan, unknownColumns: result.unknownColumns };
}

async function sitesOnFile(
  tx: Tx,
  scope: TenantScope,
  fileRows: readonly FileRow<Row>[],
): Promise<OnFile<SiteValues>[]> {
  const customerIds = [...new Set(fileRows.map((r) => r.record.customerId))];
  const refs = [...new Set(fileRows.flatMap((r) => r.record.externalRef ?? []))];
  if (!customerIds.length) return [];
  const found = await tx
    .selectFrom('site')
    .select(siteColumns)
    .where('tenantId', '=', scope.tenantId)
    .where((eb) =>
      eb.or([
        eb('customerId', 'in', customerIds),
        ...(refs.length ? [eb('externalRef', 'in', refs)] : []),
      ]),
    )
    .execute();
  return found.map(({ id, ...values }) => ({ id, keys: keysOfSite(values), values }));
}

/** Writes the planned creates and updates of a sites import. */
export async function applySiteChanges(
  tx: Tx,
  scope: TenantScope,
  changes: readonly Change<SiteValues>[],
): Promise<void> {
  const creates = changes.filter((c) => c.id === null).map((c) => c.values);
  for (let i = 0; i < creates.length; i += 500)
    await tx
      .insertInto('site')
      .values(creates.slice(i, i + 500).map((v) => ({ ...v, tenantId: scope.tenantId })))
      .execute();
  for (const change of changes) {
    if (change.id === null) continue;
    await tx
      .updateTable('site')
      .set({ ...change.values, updatedAt: new Date() })
      .where('tenantId', '=', scope.tenantId)
      .where('id', '=', change.id)
      .execute();
  }
}
