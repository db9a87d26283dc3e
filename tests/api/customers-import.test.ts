import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { withTenant } from '@latchwork/shared-db';
import { createTestApi } from './api-harness';
import { demoIds, sessionFor, type TestSession } from './sessions';

const { app, deps } = createTestApi();
afterAll(() => deps.close());

const as = (s: TestSession) => ({ Cookie: s.cookie, 'X-XSRF-TOKEN': s.csrfToken });
const tag = `im${Date.now().toString(36)}`;
let tenantA = '';
let owner: TestSession;
let books: TestSession;

beforeAll(async () => {
  const ids = await demoIds(deps.db);
  tenantA = ids.tenant('kestrel-floorworks').id;
  owner = await sessionFor(deps.db, ids.user('owner@kestrel-floorworks.test'), tenantA);
  books = await sessionFor(deps.db, ids.user('books@kestrel-floorworks.test'), tenantA);
});

/** Rows whose name, e-mail or reference carries the tag: what this file's imports wrote. */
async function tagged() {
  return withTenant(deps.db, { tenantId: tenantA }, async (tx) => ({
    customers: await tx
      .selectFrom('customer')
      .select(['id', 'name', 'kind', 'email', 'externalRef', 'creditLimitMinor', 'notes'])
      .where('tenantId', '=', tenantA)
      .where('name', 'like', `%${tag}%`)
      .orderBy('name')
      .execute(),
    sites: await tx
      .selectFrom('site')
      .select(['id', 'name', 'addressLines', 'parking'])
      .where('tenantId', '=', tenantA)
      .where('name', 'like', `%${tag}%`)
      .execute(),
  }));
}

const customersCsv = [
  'Customer Name,E-mail,Type,Account,Credit limit,Contact,Contact role,Address 1,Town,Postcode',
  `Greyling Motors ${tag},service-${tag}@greyling.test,company,GM-${tag},"£1,500.00",Rhea Greyling,Owner,2 Forge Street,Wexbridge,wx2 3pd`,
  `Ms Odile Farrant ${tag},odile-${tag}@farrant.test,domestic,,,,,18 Linnet Close,Hollinby,wx7 1ee`,
  `Brackwater Bakery ${tag},,,BB-${tag},0,,,The Old Mill,Sedgecombe,`,
  '',
].join('\r\n');

const sitesCsv = [
  'Customer reference,Customer email,Site name,Address 1,Postcode,Parking',
  `GM-${tag},,Workshop ${tag},2 Forge Street,WX2 3PD,Forecourt`,
  `,odile-${tag}@farrant.test,Garage ${tag},18 Linnet Close,WX7 1EE,Drive`,
].join('\n');

const preview = (kind: string, csv: string, who = owner) =>
  request(app).post('/api/v1/customers/import/preview').set(as(who)).send({ kind, csv });
const commit = (kind: string, csv: string) =>
  request(app).post('/api/v1/customers/import/commit').set(as(owner)).send({ kind, csv });

describe('customer import', () => {
  it('previews a plan without writing anything', async () => {
    const res = await preview('customers', customersCsv).expect(200);
    expect(res.body.counts).toEqual({ create: 3, update: 0, unchanged: 0, error: 0 });
    expect(res.body.rows.map((r: { row: number; action: string }) => [r.row, r.action])).toEqual([
      [2, 'create'],
      [3, 'create'],
      [4, 'create'],
    ]);
    expect(res.body.errors).toEqual([]);
    expect((await tagged()).customers).toEqual([]);
  });

  it('commits, then re-importing the same file changes nothing', async () => {
    const first = await commit('customers', customersCsv).expect(200);
    expect(first.body.counts).toMatchObject({ create: 3, update: 0, unchanged: 0 });
    const { customers } = await tagged();
    expect(customers.map((c) => [c.name.replace(` ${tag}`, ''), c.kind])).toEqual([
      ['Brackwater Bakery', 'business'],
      ['Greyling Motors', 'business'],
      ['Ms Odile Farrant', 'homeowner'],
    ]);
    expect(customers[1].creditLimitMinor).toBe('150000');
    const again = await preview('customers', customersCsv).expect(200);
    expect(again.body.counts).toEqual({ create: 0, update: 0, unchanged: 3, error: 0 });
    const second = await commit('customers', customersCsv).expect(200);
    expect(second.body.counts).toMatchObject({ create: 0, unchanged: 3 });
    expect((await tagged()).customers).toHaveLength(3);
  });

  it('updates a matched customer, keeping what empty cells and missing columns do not say', async () => {
    const greyling = (await tagged()).customers.find((c) => c.name.startsWith('Greyling'));
    await withTenant(deps.db, { tenantId: tenantA }, (tx) =>
      tx
        .updateTable('customer')
        .set({ kind: 'homeowner', notes: 'Kept' })
        .where('id', '=', greyling?.id ?? '')
        .execute(),
    );
    // Matched by e-mail in another case; no Type column, so the kind on file stays.
    const csv = `Name,Email,Credit limit\nGreyling Motors ${tag},SERVICE-${tag}@Greyling.test,2000\n`;
    const p = await preview('customers', csv).expect(200);
    expect(p.body.counts).toMatchObject({ update: 1, create: 0 });
    await commit('customers', csv).expect(200);
    const after = (await tagged()).customers.find((c) => c.id === greyling?.id);
    expect(after).toMatchObject({ kind: 'homeowner', notes: 'Kept', creditLimitMinor: '200000' });
  });

  it('reports each bad cell by row, column and reason, and commits nothing while any exist', async () => {
    const csv = [
      'Name,Email,Credit limit,Payment terms days,Reference',
      `Good Row ${tag},good-${tag}@rows.test,10,30,`,
      `,bad-address,12.345,400,`,
      `Twin ${tag},twin-${tag}@rows.test,,,`,
      `Twin Again ${tag},twin-${tag}@rows.test,,,`,
      `Too, many, cells ${tag},x@y.test,1,2,3,4`,
    ].join('\n');
    const res = await preview('customers', csv).expect(200);
    expect(res.body.errors).toEqual(
      expect.arrayContaining([
        { row: 3, column: 'Name', message: 'Required.' },
        { row: 3, column: 'Email', message: '"bad-address" is not an e-mail address.' },
        expect.objectContaining({ row: 3, column: 'Credit limit' }),
        expect.objectContaining({ row: 3, column: 'Payment terms days' }),
        { row: 5, column: 'e-mail', message: 'Same e-mail as row 4.' },
        expect.objectContaining({ row: 6, message: expect.stringMatching(/More cells/) }),
      ]),
    );
    expect(res.body.counts).toEqual({ create: 2, update: 0, unchanged: 0, error: 3 });
    const refused = await commit('customers', csv).expect(400);
    expect(refused.body.error.details.problems).toContainEqual({
      path: 'rows.3.Email',
      message: '"bad-address" is not an e-mail address.',
    });
    expect((await tagged()).customers.map((c) => c.name)).not.toContain(`Good Row ${tag}`);
  });

  it('imports sites against the customers by reference or e-mail, once', async () => {
    const p = await preview('sites', sitesCsv).expect(200);
    expect(p.body.counts).toEqual({ create: 2, update: 0, unchanged: 0, error: 0 });
    await commit('sites', sitesCsv).expect(200);
    const again = await preview('sites', sitesCsv).expect(200);
    expect(again.body.counts).toEqual({ create: 0, update: 0, unchanged: 2, error: 0 });
    const changed = sitesCsv.replace('Forecourt', 'Rear yard');
    expect((await preview('sites', changed).expect(200)).body.counts).toMatchObject({ update: 1 });
    await commit('sites', changed).expect(200);
    const { sites } = await tagged();
    expect(sites).toHaveLength(2);
    expect(sites.find((s) => s.name.startsWith('Workshop'))?.parking).toBe('Rear yard');
  });

  it('names the row of a site whose customer is not on file', async () => {
    const csv = `Customer reference,Address 1\nNOPE-${tag},1 Nowhere Lane\n`;
    const res = await preview('sites', csv).expect(200);
    expect(res.body.errors).toEqual([
      {
        row: 2,
        column: 'Customer reference',
        message: `No customer with reference "NOPE-${tag}" on file: import the customers first.`,
      },
    ]);
  });

  it('is for writers: the bookkeeper may not even preview', async () => {
    await preview('customers', customersCsv, books).expect(403);
  });
});
