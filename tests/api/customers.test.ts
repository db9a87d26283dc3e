import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { withTenant } from '@latchwork/shared-db';
import { createTestApi } from './api-harness';
import { demoIds, sessionFor, type TestSession } from './sessions';

const { app, deps } = createTestApi();
afterAll(() => deps.close());

const as = (s: TestSession) => ({ Cookie: s.cookie, 'X-XSRF-TOKEN': s.csrfToken });
const tag = `cu${Date.now().toString(36)}`;
let tenantA = '';
const sessions = {} as Record<
  'owner' | 'estimator' | 'books' | 'stores' | 'crew' | 'ownerB',
  TestSession
>;

beforeAll(async () => {
  const ids = await demoIds(deps.db);
  tenantA = ids.tenant('kestrel-floorworks').id;
  for (const who of ['owner', 'estimator', 'books', 'stores', 'crew'] as const)
    sessions[who] = await sessionFor(deps.db, ids.user(`${who}@kestrel-floorworks.test`), tenantA);
  sessions.ownerB = await sessionFor(
    deps.db,
    ids.user('owner@pennick-flooring.test'),
    ids.tenant('pennick-flooring').id,
  );
});

const newCustomer = (overrides: object = {}) => ({
  kind: 'business',
  name: `Harefield Gym ${tag}`,
  email: `Office-${tag}@harefield-gym.test`,
  phone: '01632 960 111',
  externalRef: `HG-${tag}`,
  billingAddressLines: ['Unit 4, Tanner Row', '', 'Wexbridge'],
  postcode: ' wx4  7hq ',
  paymentTermsDays: 14,
  creditLimitMinor: 250000,
  notes: 'Gate code from the office.',
  contacts: [
    { name: 'Imogen Strand', role: 'Manager', email: `imogen-${tag}@harefield-gym.test` },
    { name: 'Tobias Rook', role: 'Caretaker', phone: '07700 900123' },
  ],
  ...overrides,
});

const create = (body: object, who = sessions.owner) =>
  request(app).post('/api/v1/customers').set(as(who)).send(body);

describe('customers CRUD', () => {
  it('creates a customer with contacts, normalised, and reads it back with sites and jobs', async () => {
    const res = await create(newCustomer()).expect(201);
    expect(res.body).toMatchObject({
      kind: 'business',
      email: `office-${tag}@harefield-gym.test`,
      billingAddressLines: ['Unit 4, Tanner Row', 'Wexbridge'],
      postcode: 'WX4 7HQ',
      creditLimitMinor: 250000,
      currency: 'GBP',
      minorDigits: 2,
      sites: [],
      jobs: [],
      balance: null,
    });
    expect(res.body.contacts.map((c: { name: string }) => c.name)).toEqual([
      'Imogen Strand',
      'Tobias Rook',
    ]);
    const read = await request(app)
      .get(`/api/v1/customers/${res.body.id}`)
      .set(as(sessions.books))
      .expect(200);
    expect(read.body.contacts[1]).toMatchObject({ role: 'Caretaker', phone: '07700 900123' });
    const audit = await withTenant(deps.db, { tenantId: tenantA }, (tx) =>
      tx
        .selectFrom('auditLog')
        .select(['action', 'subject'])
        .where('tenantId', '=', tenantA)
        .where('subject', '=', `Harefield Gym ${tag}`)
        .execute(),
    );
    expect(audit.map((a) => a.action)).toContain('customer-created');
  });

  it('names every bad field of a create, money as integer minor units only', async () => {
    const res = await create({
      kind: 'shop',
      name: ' ',
      email: 'nope',
      creditLimitMinor: 12.5,
      paymentTermsDays: 400,
      contacts: [{ name: '' }],
    }).expect(400);
    const paths = res.body.error.details.problems.map((p: { path: string }) => p.path);
    expect(paths).toEqual(
      expect.arrayContaining([
        'kind',
        'name',
        'email',
        'creditLimitMinor',
        'paymentTermsDays',
        'contacts.0.name',
      ]),
    );
  });

  it('refuses a second customer with the same e-mail or reference, naming the field', async () => {
    const res = await create(
      newCustomer({ name: `Other ${tag}`, email: `OFFICE-${tag}@harefield-gym.test` }),
    ).expect(400);
    expect(res.body.error.details.problems.map((p: { path: string }) => p.path)).toEqual([
      'email',
      'externalRef',
    ]);
  });

  it('patches only the fields sent; contacts sent with their ids keep them', async () => {
    const made = (
      await create(newCustomer({ email: null, externalRef: null, name: `Patch ${tag}` })).expect(
        201,
      )
    ).body;
    const [imogen] = made.contacts;
    const res = await request(app)
      .patch(`/api/v1/customers/${made.id}`)
      .set(as(sessions.estimator))
      .send({
        creditLimitMinor: null,
        contacts: [
          { id: imogen.id, name: 'Imogen Strand-Hale', role: 'Director' },
          { name: 'New' },
        ],
      })
      .expect(200);
    expect(res.body).toMatchObject({ creditLimitMinor: null, notes: 'Gate code from the office.' });
    expect(res.body.contacts).toEqual([
      expect.objectContaining({ id: imogen.id, name: 'Imogen Strand-Hale', role: 'Director' }),
      expect.objectContaining({ name: 'New', role: '' }),
    ]);
  });

  it('deletes a customer without jobs, and refuses (409) one with jobs', async () => {
    const free = (await create(newCustomer({ email: null, externalRef: null }))).body;
    const busy = (await create(newCustomer({ email: null, externalRef: null }))).body;
    await withTenant(deps.db, { tenantId: tenantA }, (tx) =>
      tx
        .insertInto('job')
        .values({
          tenantId: tenantA,
          number: 900000 + Math.floor(Math.random() * 90000),
          reference: `T-${tag}`,
          title: 'Gym floor',
          customerId: busy.id,
          valueEstimateMinor: 480000,
        })
        .execute(),
    );
    const detail = await request(app)
      .get(`/api/v1/customers/${busy.id}`)
      .set(as(sessions.owner))
      .expect(200);
    expect(detail.body.jobs).toEqual([
      expect.objectContaining({
        reference: `T-${tag}`,
        stage: 'enquiry',
        valueEstimateMinor: 480000,
      }),
    ]);
    const refused = await request(app)
      .delete(`/api/v1/customers/${busy.id}`)
      .set(as(sessions.owner))
      .expect(409);
    expect(refused.body.error.message).toMatch(/1 job/);
    await request(app).delete(`/api/v1/customers/${free.id}`).set(as(sessions.owner)).expect(204);
    await request(app).get(`/api/v1/customers/${free.id}`).set(as(sessions.owner)).expect(404);
  });
});

describe('sites', () => {
  it('adds, reads, changes and removes a site; refuses removal while a job uses it', async () => {
    const customer = (await create(newCustomer({ email: null, externalRef: null }))).body;
    const site = await request(app)
      .post(`/api/v1/customers/${customer.id}/sites`)
      .set(as(sessions.estimator))
      .send({
        name: 'Main hall',
        addressLines: ['4 Tanner Row', ''],
        postcode: 'wx4 7hq',
        accessNotes: 'Side door',
        parking: 'Yard',
        floorType: 'Power-floated concrete',
        openingHours: '6am–10pm',
      })
      .expect(201);
    expect(site.body).toMatchObject({ addressLines: ['4 Tanner Row'], postcode: 'WX4 7HQ' });
    const patched = await request(app)
      .patch(`/api/v1/sites/${site.body.id}`)
      .set(as(sessions.owner))
      .send({ parking: 'Street only' })
      .expect(200);
    expect(patched.body).toMatchObject({ parking: 'Street only', accessNotes: 'Side door' });
    const page = await request(app)
      .get(`/api/v1/customers/${customer.id}`)
      .set(as(sessions.owner))
      .expect(200);
    expect(page.body.sites.map((s: { id: string }) => s.id)).toEqual([site.body.id]);

    await withTenant(deps.db, { tenantId: tenantA }, (tx) =>
      tx
        .insertInto('job')
        .values({
          tenantId: tenantA,
          number: 900000 + Math.floor(Math.random() * 90000),
          reference: `S-${tag}`,
          title: 'Hall floor',
          customerId: customer.id,
          siteId: site.body.id,
        })
        .execute(),
    );
    await request(app).delete(`/api/v1/sites/${site.body.id}`).set(as(sessions.owner)).expect(409);
    const spare = await request(app)
      .post(`/api/v1/customers/${customer.id}/sites`)
      .set(as(sessions.owner))
      .send({ addressLines: ['Store room'] })
      .expect(201);
    await request(app).delete(`/api/v1/sites/${spare.body.id}`).set(as(sessions.owner)).expect(204);
    await request(app).get(`/api/v1/sites/${spare.body.id}`).set(as(sessions.owner)).expect(404);
  });

  it('needs the first address line', async () => {
    const customer = (await create(newCustomer({ email: null, externalRef: null }))).body;
    const res = await request(app)
      .post(`/api/v1/customers/${customer.id}/sites`)
      .set(as(sessions.owner))
      .send({ addressLines: [' '] })
      .expect(400);
    expect(res.body.error.details.problems[0].path).toBe('addressLines');
  });
});

describe('who may do what', () => {
  it('lets the bookkeeper read but not write; stores and installers get 403', async () => {
    const customer = (await create(newCustomer({ email: null, externalRef: null }))).body;
    await request(app).get(`/api/v1/customers/${customer.id}`).set(as(sessions.books)).expect(200);
    await create(newCustomer({ email: null, externalRef: null }), sessions.books).expect(403);
    await request(app)
      .patch(`/api/v1/customers/${customer.id}`)
      .set(as(sessions.books))
      .send({ notes: 'x' })
      .expect(403);
    for (const who of [sessions.stores, sessions.crew]) {
      await request(app).get(`/api/v1/customers/${customer.id}`).set(as(who)).expect(403);
      await request(app).get('/api/v1/customers').set(as(who)).expect(403);
    }
  });

  it('shows firm B nothing of firm A: every id route answers 404', async () => {
    const customer = (await create(newCustomer({ email: null, externalRef: null }))).body;
    const site = (
      await request(app)
        .post(`/api/v1/customers/${customer.id}/sites`)
        .set(as(sessions.owner))
        .send({ addressLines: ['1 Isolation Yard'] })
    ).body;
    const b = as(sessions.ownerB);
    await request(app).get(`/api/v1/customers/${customer.id}`).set(b).expect(404);
    await request(app).patch(`/api/v1/customers/${customer.id}`).set(b).send({}).expect(404);
    await request(app).delete(`/api/v1/customers/${customer.id}`).set(b).expect(404);
    await request(app)
      .post(`/api/v1/customers/${customer.id}/sites`)
      .set(b)
      .send({ addressLines: ['x'] })
      .expect(404);
    await request(app).get(`/api/v1/sites/${site.id}`).set(b).expect(404);
    await request(app).patch(`/api/v1/sites/${site.id}`).set(b).send({}).expect(404);
    await request(app).delete(`/api/v1/sites/${site.id}`).set(b).expect(404);
    await request(app).get(`/api/v1/customers/${customer.id}`).set(as(sessions.owner)).expect(200);
  });
});
