/**
 * Customer rows from a CSV import: columns, validation and the keys that match a row to a
 * customer already on file (e-mail, or the reference from the firm's previous system).
 */
import {
  CellError,
  email,
  oneOf,
  parseRows,
  phone,
  postcode,
  text,
  wholeNumber,
  type CsvRows,
  type ImportResult,
  type ParsedRecord,
} from './import-fields';
import { parseMoneyToMinor } from './money';

export type CustomerKind = 'business' | 'homeowner';

const KIND_WORDS: Readonly<Record<string, CustomerKind>> = {
  business: 'business',
  company: 'business',
  commercial: 'business',
  trade: 'business',
  homeowner: 'homeowner',
  domestic: 'homeowner',
  private: 'homeowner',
  residential: 'homeowner',
};

/** Builds the column specs; money needs the currency's minor-unit digits. */
function customerColumns(digits: number) {
  return {
    name: {
      heading: 'Name',
      aliases: ['customer', 'customer name', 'company'],
      required: true,
      parse: text(200),
    },
    kind: {
      heading: 'Type',
      aliases: ['kind', 'customer type'],
      parse: oneOf(KIND_WORDS, '"business" or "homeowner"'),
    },
    email: { heading: 'Email', aliases: ['email address'], parse: email },
    phone: { heading: 'Phone', aliases: ['telephone', 'tel', 'mobile'], parse: phone },
    externalRef: {
      heading: 'Reference',
      aliases: ['ref', 'external ref', 'account', 'account no'],
      // The customer table holds at most 60 characters (migration 2026_12_02_0100).
      parse: text(60),
    },
    contactName: { heading: 'Contact', aliases: ['contact name'], parse: text(200) },
    contactRole: { heading: 'Contact role', aliases: ['role', 'position'], parse: text(100) },
    address1: {
      heading: 'Address 1',
      aliases: ['address', 'address line 1', 'street'],
      parse: text(200),
    },
    address2: { heading: 'Address 2', aliases: ['address line 2'], parse: text(200) },
    town: { heading: 'Town', aliases: ['city'], parse: text(100) },
    postcode: {
      heading: 'Postcode',
      aliases: ['post code', 'zip', 'postal code'],
      parse: postcode,
    },
    country: { heading: 'Country', parse: text(100) },
    // Same range as the firm's own payment terms in tenant settings.
    paymentTermsDays: {
      heading: 'Payment terms days',
      aliases: ['payment terms', 'terms'],
      parse: wholeNumber(0, 365),
    },
    creditLimitMinor: {
      heading: 'Credit limit',
      parse: (t: string) => {
        const v = parseMoneyToMinor(t, digits);
        return v !== null && v >= 0 ? v : new CellError(`"${t}" is not an amount of money.`);
      },
    },
    notes: { heading: 'Notes', parse: text(2000) },
  } as const;
}

type CustomerColumns = ReturnType<typeof customerColumns>;

/** A validated customer row; `kind` is filled from the default when the cell was empty. */
export type CustomerImportRecord = Omit<ParsedRecord<CustomerColumns>, 'kind'> & {
  kind: CustomerKind;
};

export interface CustomerImportOptions {
  /** For rows without a type. */
  readonly defaultKind?: CustomerKind;
  /** The currency's minor-unit digits (ISO 4217), for the credit limit. */
  readonly minorDigits?: number;
}

/** Validates parsed customer rows: per-row errors and the normalised records. */
export function validateCustomerRows(
  rows: CsvRows,
  options: CustomerImportOptions = {},
): ImportResult<CustomerImportRecord> {
  const result = parseRows(rows, customerColumns(options.minorDigits ?? 2));
  return {
    ...result,
    records: result.records.map(({ row, record }) => ({
      row,
      record: { ...record, kind: record.kind ?? options.defaultKind ?? 'business' },
    })),
  };
}

/**
 * The keys that identify a customer across imports. The server builds the same keys for
 * customers already on file, so a re-import finds them.
 */
export function customerKeys(c: {
  readonly email: string | null;
  readonly externalRef: string | null;
}): string[] {
  return [
    ...(c.externalRef ? [`ref:${c.externalRef}`] : []),
    ...(c.email ? [`email:${c.email.toLowerCase()}`] : []),
  ];
}
