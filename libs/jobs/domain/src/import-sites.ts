/**
 * Site rows from a CSV import. A site names its customer by the customer's reference or
 * e-mail (the same keys as the customer import), so one file of customers and one of sites
 * can be imported one after the other.
 */
import {
  email,
  parseRows,
  postcode,
  text,
  type CsvRows,
  type ImportResult,
  type ParsedRecord,
} from './import-fields';

const siteColumns = {
  customerRef: {
    heading: 'Customer reference',
    aliases: ['customer ref', 'account', 'account no'],
    parse: text(60),
  },
  customerEmail: { heading: 'Customer email', parse: email },
  name: { heading: 'Site name', aliases: ['site', 'name'], parse: text(200) },
  // References are at most 60 characters in the customer and site tables.
  externalRef: { heading: 'Site reference', aliases: ['site ref'], parse: text(60) },
  address1: {
    heading: 'Address 1',
    aliases: ['address', 'address line 1', 'street'],
    required: true,
    parse: text(200),
  },
  address2: { heading: 'Address 2', aliases: ['address line 2'], parse: text(200) },
  town: { heading: 'Town', aliases: ['city'], parse: text(100) },
  postcode: { heading: 'Postcode', aliases: ['post code', 'zip', 'postal code'], parse: postcode },
  country: { heading: 'Country', parse: text(100) },
  accessNotes: { heading: 'Access notes', aliases: ['access'], parse: text(2000) },
  parking: { heading: 'Parking', parse: text(500) },
  floorType: { heading: 'Floor type', aliases: ['floor', 'substrate'], parse: text(100) },
  openingHours: { heading: 'Opening hours', aliases: ['hours'], parse: text(200) },
} as const;

export type SiteImportRecord = ParsedRecord<typeof siteColumns>;

/**
 * Validates parsed site rows. Besides each cell's own rule, a row must say whose site it is
 * (customer reference or customer e-mail).
 */
export function validateSiteRows(rows: CsvRows): ImportResult<SiteImportRecord> {
  const result = parseRows(rows, siteColumns);
  const errors = [...result.errors];
  const records = result.records.filter(({ row, record }) => {
    if (record.customerRef || record.customerEmail) return true;
    errors.push({
      row,
      column: siteColumns.customerRef.heading,
      message: 'Say whose site this is: the customer reference or the customer e-mail.',
    });
    return false;
  });
  errors.sort((a, b) => a.row - b.row);
  return { records, errors, unknownColumns: result.unknownColumns };
}

/** The customer key a site row points at (matches `customerKeys` of the customer). */
export function siteCustomerKey(s: SiteImportRecord): string {
  return s.customerRef ? `ref:${s.customerRef}` : `email:${s.customerEmail}`;
}

/**
 * Keys that identify a site across imports: its own reference if it has one, and always its
 * customer + first address line + postcode, compared without case or spacing differences.
 * `customerId` is the customer the row resolved to (through `siteCustomerKey`), so a file
 * naming the customer by e-mail still finds a site first imported by reference.
 */
export function siteKeys(s: {
  readonly externalRef: string | null;
  readonly address1: string | null;
  readonly postcode: string | null;
  readonly customerId: string;
}): string[] {
  const fold = (v: string | null) =>
    (v ?? '')
      .toLowerCase()
      .replace(/[\s,.]+/g, ' ')
      .trim();
  return [
    ...(s.externalRef ? [`ref:${s.externalRef}`] : []),
    `address:${s.customerId}|${fold(s.address1)}|${fold(s.postcode)}`,
  ];
}
