import { describe, expect, it } from 'vitest';
import { customerKeys, validateCustomerRows } from './import-customers';
import { normaliseHeading } from './import-fields';
import { fingerprint, planImport, type ExistingKeys } from './import-plan';
import { siteCustomerKey, siteKeys, validateSiteRows } from './import-sites';

// A customers file as papaparse gives it with `header: true` (strings only, own headings).
const customersFile = [
  {
    'Customer Name': 'Harrow & Vale Motors',
    'E-mail': 'Office@HarrowVale.test',
    Type: 'Company',
    Account: 'HV001',
    'Credit limit': '£5,000.00',
    Terms: '30',
  },
  {
    'Customer Name': 'Mrs P. Lindqvist',
    'E-mail': 'p.lindqvist@example.test',
    Type: 'domestic',
    Account: '',
    'Credit limit': '',
    Terms: '',
  },
  {
    'Customer Name': '',
    'E-mail': 'not-an-address',
    Type: 'shop',
    Account: '',
    'Credit limit': '12.345',
    Terms: '400',
  },
  { 'Customer Name': '', 'E-mail': '', Type: '', Account: '', 'Credit limit': '', Terms: '' },
  {
    'Customer Name': 'Brackley Gym Ltd',
    'E-mail': '',
    Type: '',
    Account: 'BG-7',
    'Credit limit': '0',
    Terms: '14',
  },
];

describe('validateCustomerRows', () => {
  it('normalises good rows and names row, column and reason for bad cells', () => {
    const r = validateCustomerRows(customersFile, { defaultKind: 'homeowner' });
    expect(r.records.map((x) => x.row)).toEqual([2, 3, 6]);
    expect(r.records[0].record).toMatchObject({
      name: 'Harrow & Vale Motors',
      email: 'office@harrowvale.test',
      kind: 'business',
      externalRef: 'HV001',
      creditLimitMinor: 500000,
      paymentTermsDays: 30,
      phone: null,
    });
    expect(r.records[1].record).toMatchObject({ kind: 'homeowner', externalRef: null });
    expect(r.records[2].record).toMatchObject({ kind: 'homeowner', creditLimitMinor: 0 });
    // Row 4 (the third data row; header is row 1, as a spreadsheet counts). Row 5 is blank.
    expect(r.errors).toEqual([
      { row: 4, column: 'Name', message: 'Required.' },
      { row: 4, column: 'Type', message: 'Use "business" or "homeowner".' },
      { row: 4, column: 'Email', message: '"not-an-address" is not an e-mail address.' },
      { row: 4, column: 'Payment terms days', message: 'A whole number from 0 to 365.' },
      { row: 4, column: 'Credit limit', message: '"12.345" is not an amount of money.' },
    ]);
    expect(r.unknownColumns).toEqual([]);
  });

  it('reports unknown columns and checks phones (ITU-T E.164: at most 15 digits)', () => {
    const r = validateCustomerRows([
      { name: 'A', phone: '+44 (0)20 7946 0000', Fax: '1' },
      { name: 'B', phone: '0123 45678 90123 4567' },
      { name: 'C', phone: 'call me' },
    ]);
    expect(r.unknownColumns).toEqual(['Fax']);
    expect(r.records[0].record.phone).toBe('+44 (0)20 7946 0000');
    expect(r.errors.map((e) => [e.row, e.column])).toEqual([
      [3, 'Phone'],
      [4, 'Phone'],
    ]);
  });

  it('e-mail: 254 characters at most (RFC 5321 path limit)', () => {
    const long = `${'a'.repeat(64)}@${'b'.repeat(185)}.test`; // 255
    expect(validateCustomerRows([{ name: 'A', email: long }]).errors).toHaveLength(1);
    expect(validateCustomerRows([{ name: 'A', email: long.slice(1) }]).errors).toHaveLength(0);
  });

  it('references: 60 characters at most, as the customer and site tables hold', () => {
    const ref = 'R'.repeat(61);
    expect(validateCustomerRows([{ name: 'A', ref }]).errors).toEqual([
      { row: 2, column: 'Reference', message: 'At most 60 characters (this has 61).' },
    ]);
    expect(validateCustomerRows([{ name: 'A', ref: ref.slice(1) }]).errors).toEqual([]);
    const site = { 'customer ref': 'C1', address: '1 Mill Row' };
    expect(validateSiteRows([{ ...site, 'site ref': ref }]).errors).toHaveLength(1);
    expect(validateSiteRows([{ ...site, 'customer ref': ref }]).errors).toHaveLength(1);
  });

  it('headings match whatever spacing, case or separators people use', () => {
    expect(normaliseHeading('\uFEFFE-Mail_Address ')).toBe('email address');
    expect(normaliseHeading('Post.Code')).toBe('post code');
  });
});

describe('planImport: re-importing the same file does not duplicate (common practice)', () => {
  const plan = (existing: ExistingKeys[]) => {
    const { records } = validateCustomerRows(customersFile);
    return planImport(
      records.map(({ row, record }) => ({
        row,
        keys: customerKeys(record),
        fingerprint: fingerprint(record),
      })),
      existing,
    );
  };
  // What the server would hold after the first import, keyed the same way.
  const stored = (): ExistingKeys[] =>
    validateCustomerRows(customersFile).records.map(({ record }, i) => ({
      id: `c${i}`,
      keys: customerKeys(record),
      fingerprint: fingerprint({ ...record }),
    }));

  it('first import creates, the second changes nothing, an edited row updates', () => {
    expect(plan([]).counts).toEqual({ create: 3, update: 0, unchanged: 0 });
    expect(plan(stored()).counts).toEqual({ create: 0, update: 0, unchanged: 3 });
    const edited = stored().map((e, i) => (i === 1 ? { ...e, fingerprint: 'older' } : e));
    const p = plan(edited);
    expect(p.actions[1]).toEqual({ row: 3, action: 'update', id: 'c1' });
    expect(p.counts).toEqual({ create: 0, update: 1, unchanged: 2 });
  });

  it('matches on e-mail (any case) or reference; flags in-file repeats and split matches', () => {
    const p = planImport(
      [
        { row: 2, keys: customerKeys({ email: 'A@x.test', externalRef: null }), fingerprint: 'f' },
        { row: 3, keys: customerKeys({ email: 'b@x.test', externalRef: 'R1' }), fingerprint: 'f' },
        { row: 4, keys: customerKeys({ email: 'a@x.test', externalRef: 'R9' }), fingerprint: 'f' },
        { row: 5, keys: customerKeys({ email: 'c@x.test', externalRef: 'R2' }), fingerprint: 'f' },
      ],
      [
        { id: 'a', keys: customerKeys({ email: 'a@x.test', externalRef: null }), fingerprint: 'f' },
        { id: 'r1', keys: ['ref:R1'], fingerprint: 'g' },
        { id: 'r2', keys: ['ref:R2'], fingerprint: 'f' },
        { id: 'c', keys: ['email:c@x.test'], fingerprint: 'f' },
      ],
    );
    expect(p.actions).toEqual([
      { row: 2, action: 'unchanged', id: 'a' },
      { row: 3, action: 'update', id: 'r1' },
    ]);
    expect(p.errors).toEqual([
      { row: 4, column: 'e-mail', message: 'Same e-mail as row 2.' },
      {
        row: 5,
        column: 'reference',
        message: 'Its reference and e-mail match different records on file.',
      },
    ]);
  });

  it('fingerprints ignore field order', () => {
    expect(fingerprint({ a: 1, b: null })).toBe(fingerprint({ b: null, a: 1 }));
    expect(fingerprint({ a: 1 })).not.toBe(fingerprint({ a: 2 }));
  });
});

describe('site rows', () => {
  it('need an address and a customer; keys survive a change of spacing', () => {
    const r = validateSiteRows([
      {
        'Customer ref': 'HV001',
        'Site name': 'Unit 4',
        Address: '4 Kiln Lane',
        Postcode: 'hx1  4ab',
        Access: 'Key from unit 3',
      },
      { 'Customer email': 'p.lindqvist@example.test', Address: '' },
      { Address: '9 Mill Row' },
    ]);
    expect(r.records).toHaveLength(1);
    const site = r.records[0].record;
    expect(site).toMatchObject({
      postcode: 'HX1 4AB',
      accessNotes: 'Key from unit 3',
      customerRef: 'HV001',
    });
    expect(siteCustomerKey(site)).toBe('ref:HV001');
    expect(r.errors.map((e) => [e.row, e.column])).toEqual([
      [3, 'Address 1'],
      [4, 'Customer reference'],
    ]);
    const a = siteKeys({ ...site, customerId: 'c1' });
    const b = siteKeys({
      externalRef: null,
      address1: '4 kiln  lane',
      postcode: 'HX1 4AB',
      customerId: 'c1',
    });
    expect(a.at(-1)).toBe(b.at(-1));
  });
});
