import { randomUUID } from 'node:crypto';
import type { TenantScope, Tx } from '@latchwork/shared-db';
import {
  customerKeys,
  validateCustomerRows,
  type CsvRows,
  type CustomerImportRecord,
  type CustomerKind,
  type RowError,
} from '@latchwork/jobs-domain';
import { customerFields, minorOrNull } from './customer.repository';
import { planRows, type Change, type ImportKind, type OnFile } from './import-planner';

interface ContactValues {
  id: string | null;
  name: string;
  role: string;
}

/** A customer as the import reads and writes it. */
export interface CustomerValues {
  kind: CustomerKind;
  name: string;
  email: string | null;
  phone: string | null;
  externalRef: string | null;
  billingAddressLines: string[];
  postcode: string | null;
  paymentTermsDays: number | null;
  creditLimitMinor: number | null;
  notes: string;
  contacts: ContactValues[];
}

type Row = CustomerImportRecord & { kindGiven: boolean };

const present = <T>(v: T | null): v is T => v !== null;
const sameName = (a: string, b: string) => a.toLocaleLowerCase() === b.toLocaleLowerCase();

/** Adds the row's contact, or changes the role of the contact of that name already on file. */
function withContact(contacts: ContactValues[], name: string | null, role: string | null) {
  if (!name) return contacts;
  const at = contacts.findIndex((c) => sameName(c.name, name));
  if (at < 0) return [...contacts, { id: null, name, role: role ?? '' }];
  if (role === null || contacts[at].role === role) return contacts;
  return contacts.map((c, i) => (i === at ? { ...c, role } : c));
}

/** Empty cells keep what is on file: an import fills in and corrects, it never blanks. */
const customerKind: ImportKind<Row, CustomerValues> = {
  merge(base, r) {
    const lines = [r.address1, r.address2, r.town, r.country].filter(present);
    return {
      kind: r.kindGiven || !base ? r.kind : base.kind,
      name: r.name ?? base?.name ?? '',
      email: r.email ?? base?.email ?? null,
      phone: r.phone ?? base?.phone ?? null,
      externalRef: r.externalRef ?? base?.externalRef ?? null,
      billingAddressLines: lines.length ? lines : (base?.billingAddressLines ?? []),
      postcode: r.postcode ?? base?.postcode ?? null,
      paymentTermsDays: r.paymentTermsDays ?? base?.paymentTermsDays ?? null,
      creditLimitMinor: r.creditLimitMinor ?? base?.creditLimitMinor ?? null,
      notes: r.notes ?? base?.notes ?? '',
      contacts: withContact(base?.contacts ?? [], r.contactName, r.contactRole),
    };
  },
  comparable: ({ contacts, ...v }) => ({
    ...v,
    contacts: contacts.map((c) => [c.name, c.role]),
  }),
  label: (r) => r.name ?? '',
};

/** The firm's customers that have one of the e-mails or references. */
export function customersByKeys(
  tx: Tx,
  scope: TenantScope,
  emails: readonly string[],
  refs: readonly string[],
) {
  return tx
    .selectFrom('customer')
    .select(['id', ...customerFields])
    .where('tenantId', '=', scope.tenantId)
    .where((eb) =>
      eb.or([
        ...(emails.length ? [eb('email', 'in', emails)] : []),
        ...(refs.length ? [eb('externalRef', 'in', refs)] : []),
      ]),
    )
    .execute();
}

/** The customers on file that share an e-mail or reference with the file's rows. */
async function customersOnFile(
  tx: Tx,
  scope: TenantScope,
  rows: readonly Row[],
): Promise<OnFile<CustomerValues>[]> {
  const emails = [...new Set(rows.flatMap((r) => r.email ?? []))];
  const refs = [...new Set(rows.flatMap((r) => r.externalRef ?? []))];
  if (!emails.length && !refs.length) return [];
  const found = await customersByKeys(tx, scope, emails, refs);
  const contacts = found.length
    ? await tx
        .selectFrom('customerContact')
        .select(['id', 'customerId', 'name', 'role'])
        .where('tenantId', '=', scope.tenantId)
        .where(
          'customerId',
          'in',
          found.map((c) => c.id),
        )
        .orderBy('position')
        .execute()
    : [];
  return found.map(({ id, ...c }) => ({
    id,
    keys: customerKeys(c),
    values: {
      ...c,
      creditLimitMinor: minorOrNull(c.creditLimitMinor),
      contacts: contacts
        .filter((k) => k.customerId === id)
        .map((k) => ({ id: k.id, name: k.name, role: k.role })),
    },
  }));
}

/**
 * Plans a customers file against the firm's customers. `kindGiven` tells a row that named
 * its type from one that took the default: the rules fill the default either way, so the
 * rows are read twice with different defaults and a type that differs was not in the file.
 */
export async function planCustomerImport(
  tx: Tx,
  scope: TenantScope,
  rows: CsvRows,
  csvErrors: readonly RowError[],
  minorDigits: number,
) {
  const result = validateCustomerRows(rows, { minorDigits, defaultKind: 'business' });
  const other = validateCustomerRows(rows, { minorDigits, defaultKind: 'homeowner' });
  const otherKind = new Map(other.records.map((r) => [r.row, r.record.kind]));
  const badRows = new Set(csvErrors.map((e) => e.row));
  const records = result.records
    .filter((r) => !badRows.has(r.row))
    .map(({ row, record }) => ({
      row,
      record: { ...record, kindGiven: otherKind.get(row) === record.kind },
    }));
  const onFile = await customersOnFile(
    tx,
    scope,
    records.map((r) => r.record),
  );
  const fileRows = records.map((r) => ({ ...r, keys: customerKeys(r.record) }));
  const plan = planRows(customerKind, fileRows, onFile, [...csvErrors, ...result.errors]);
  return { ...plan, unknownColumns: result.unknownColumns };
}

const CHUNK = 500;

/** Writes the planned creates (in batches) and updates of a customers import. */
export async function applyCustomerChanges(
  tx: Tx,
  scope: TenantScope,
  changes: readonly Change<CustomerValues>[],
  createdBy: string,
): Promise<void> {
  const creates = changes.filter((c) => c.id === null);
  for (let i = 0; i < creates.length; i += CHUNK) {
    const batch = creates
      .slice(i, i + CHUNK)
      .map(({ values: { contacts, ...v } }) => ({ id: randomUUID(), v, contacts }));
    await tx
      .insertInto('customer')
      .values(batch.map((b) => ({ ...b.v, id: b.id, tenantId: scope.tenantId, createdBy })))
      .execute();
    const contacts = batch.flatMap((b) =>
      b.contacts.map((c, position) => ({
        tenantId: scope.tenantId,
        customerId: b.id,
        name: c.name,
        role: c.role,
        position,
      })),
    );
    if (contacts.length) await tx.insertInto('customerContact').values(contacts).execute();
  }
  for (const change of changes) {
    if (change.id === null) continue;
    const { contacts, ...v } = change.values;
    await tx
      .updateTable('customer')
      .set({ ...v, updatedAt: new Date() })
      .where('tenantId', '=', scope.tenantId)
      .where('id', '=', change.id)
      .execute();
    for (const [position, c] of contacts.entries()) {
      if (c.id)
        await tx
          .updateTable('customerContact')
          .set({ role: c.role })
          .where('tenantId', '=', scope.tenantId)
          .where('id', '=', c.id)
          .execute();
      else
        await tx
          .insertInto('customerContact')
          .values({
            tenantId: scope.tenantId,
            customerId: change.id,
            name: c.name,
            role: c.role,
            position,
          })
          .execute();
    }
  }
}
