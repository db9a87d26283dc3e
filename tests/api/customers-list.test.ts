import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { withTenant } from '@latchwork/shared-db';
import { createTestApi } from './api-harness';
import { demoIds, sessionFor, type TestSession } from './sessions';

const { app, deps } = createTestApi();
afterAll(() => deps.close());

const as = (s: TestSession) => ({ Cookie: s.cookie, 'X-XSRF-TOKEN': s.csrfToken });
/** A word no other test or demo customer contains, so searches see only this file's rows. */
const tag = `zq${Date.now().toString(36)}`;
let tenantA = '';
let owner: TestSession;
let ownerB: TestSession;
let books: TestSession;
let stores: TestSession;
let firstId = '';

beforeAll(async () => {
  const ids = await demoIds(deps.db);
  tenantA = ids.tenant('kestrel-floorworks').id;
  owner = await sessionFor(deps.db, ids.user('owner@kestrel-floorworks.test'), tenantA);
  books = await sessionFor(deps.db, ids.user('books@kestrel-floorworks.test'), tenantA);
  stores = await sessionFor(deps.db, ids.user('stores@kestrel-floorworks.test'), tenantA);
  const tenantB = ids.tenant('pennick-flooring').id;
  ownerB = await sessionFor(deps.db, ids.user('owner@pennick-flooring.test'), tenantB);
  // Five customers: names out of alphabetical order of creation, postcodes with one empty.
  const names = ['Delta Motors', 'alpha Gym', 'Charlie Bakery', 'Bravo Storage', 'Echo Homes'];
  const postcodes = ['WX3 1AA', 'WX1 9ZZ', null, 'WX2 5BB', 'WX1 1AA'];
  await withTenant(deps.db, { tenantId: tenantA }, async (tx) => {
    for (const [i, name] of names.entries()) {
      const c = await tx
        .insertInto('customer')
        .values({
          tenantId: tenantA,
          kind: i === 4 ? 'homeowner' : 'business',
          name: `${name} ${tag}`,
          email: `${name.split(' ')[0].toLowerCase()}-${tag}@list.test`,
          postcode: postcodes[i],
          externalRef: `${tag}-${i}`,
          createdAt: new Date(Date.UTC(2026, 0, 1 + i)),
        })
        .returning('id')
        .executeTakeFirstOrThrow();
      if (i === 0) firstId = c.id;
      for (let s = 0; s < i; s++)
        await tx
          .insertInto('site')
          .values({
            tenantId: tenantA,
            customerId: c.id,
            name: `Unit ${s + 1}`,
            addressLines: [`${s + 1} Quarry Lane`],
          })
          .execute();
    }
  });
});

const list = (query: string, s = owner) =>
  request(app).get(`/api/v1/customers?${query}`).set(as(s)).expect(200);
const names = (body: { items: { name: string }[] }) =>
  body.items.map((c) => c.name.replace(` ${tag}`, ''));

describe('GET /customers', () => {
  it('searches name, e-mail, postcode and reference, ignoring case', async () => {
    expect((await list(`q=${tag.toUpperCase()}`)).body.total).toBe(5);
    expect(names((await list(`q=charlie bakery ${tag}`)).body)).toEqual(['Charlie Bakery']);
    expect(names((await list(`q=bravo-${tag}@list`)).body)).toEqual(['Bravo Storage']);
    expect(names((await list(`q=${tag}-3`)).body)).toEqual(['Bravo Storage']);
    // Postcode is not part of the tagged text, so narrow by tag through the name first.
    const byPostcode = await list(`q=wx1 9zz`);
    expect(names(byPostcode.body)).toContain('alpha Gym');
  });

  it('finds a customer by its new name after a change, not by the old one', async () => {
    const renamed = `Foxtrot Joinery ${tag}`;
    await request(app)
      .patch(`/api/v1/customers/${firstId}`)
      .set(as(owner))
      .send({ name: renamed })
      .expect(200);
    expect(names((await list(`q=foxtrot joinery ${tag}`)).body)).toEqual(['Foxtrot Joinery']);
    expect((await list(`q=delta motors ${tag}`)).body.total).toBe(0);
    await request(app)
      .patch(`/api/v1/customers/${firstId}`)
      .set(as(owner))
      .send({ name: `Delta Motors ${tag}` })
      .expect(200);
  });

  it('treats % and _ in the search as ordinary characters', async () => {
    expect((await list(`q=${encodeURIComponent(`%${tag}`)}`)).body.total).toBe(0);
  });

  it('sorts by name ignoring case, by creation and by postcode (empty last)', async () => {
    expect(names((await list(`q=${tag}&sort=name`)).body)).toEqual([
      'alpha Gym',
      'Bravo Storage',
      'Charlie Bakery',
      'Delta Motors',
      'Echo Homes',
    ]);
    expect(names((await list(`q=${tag}&sort=createdAt&dir=desc`)).body)[0]).toBe('Echo Homes');
    expect(names((await list(`q=${tag}&sort=postcode`)).body)).toEqual([
      'Echo Homes',
      'alpha Gym',
      'Bravo Storage',
      'Delta Motors',
      'Charlie Bakery',
    ]);
    expect(names((await list(`q=${tag}&sort=postcode&dir=desc`)).body).at(-1)).toBe(
      'Charlie Bakery',
    );
  });

  it('pages with the total of all matches', async () => {
    const p1 = await list(`q=${tag}&pageSize=2&page=1`);
    const p3 = await list(`q=${tag}&pageSize=2&page=3`);
    expect(p1.body.total).toBe(5);
    expect(names(p1.body)).toEqual(['alpha Gym', 'Bravo Storage']);
    expect(names(p3.body)).toEqual(['Echo Homes']);
  });

  it('counts sites and open jobs per customer', async () => {
    const body = (await list(`q=${tag}&sort=createdAt`)).body;
    expect(body.items.map((c: { siteCount: number }) => c.siteCount)).toEqual([0, 1, 2, 3, 4]);
    expect(body.items[0]).toMatchObject({ openJobCount: 0, kind: 'business' });
  });

  it('names the bad query field', async () => {
    const res = await request(app).get('/api/v1/customers?sort=colour').set(as(owner)).expect(400);
    expect(res.body.error.details.problems[0].path).toBe('query.sort');
  });

  it('lets the bookkeeper read, not the stores role, and shows firm B none of firm A', async () => {
    expect((await list(`q=${tag}`, books)).body.total).toBe(5);
    await request(app).get('/api/v1/customers').set(as(stores)).expect(403);
    expect((await list(`q=${tag}`, ownerB)).body.total).toBe(0);
  });
});

describe('GET /customers/:customerId/sites', () => {
  it('lists the sites of a customer and 404s for another firm', async () => {
    const bravo = (await list(`q=bravo storage ${tag}`)).body.items[0];
    const sites = await request(app)
      .get(`/api/v1/customers/${bravo.id}/sites`)
      .set(as(owner))
      .expect(200);
    expect(sites.body.map((s: { name: string }) => s.name)).toEqual(['Unit 1', 'Unit 2', 'Unit 3']);
    expect(sites.body[0]).toEqual({
      id: expect.any(String),
      name: 'Unit 1',
      addressLines: ['1 Quarry Lane'],
      postcode: null,
    });
    await request(app).get(`/api/v1/customers/${firstId}/sites`).set(as(ownerB)).expect(404);
  });
});
