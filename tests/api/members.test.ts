import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { withTenant } from '@latchwork/shared-db';
import { waitForMessagesTo } from '../support/stack';
import { createTestApi } from './api-harness';
import { demoIds, sessionFor, type TestSession } from './sessions';

const { app, deps } = createTestApi();
afterAll(() => deps.close());

let tenantA = '';
let tenantB = '';
let owner: TestSession;
let ownerId = '';
let ids: Awaited<ReturnType<typeof demoIds>>;

const as = (s: TestSession) => ({ Cookie: s.cookie, 'X-XSRF-TOKEN': s.csrfToken });

beforeAll(async () => {
  ids = await demoIds(deps.db);
  tenantA = ids.tenant('kestrel-floorworks').id;
  tenantB = ids.tenant('pennick-flooring').id;
  ownerId = ids.user('owner@kestrel-floorworks.test');
  owner = await sessionFor(deps.db, ownerId, tenantA);
});

describe('me and the firm switcher', () => {
  it('answers 401 when signed out', async () => {
    const res = await request(app).get('/api/v1/me').expect(401);
    expect(res.body.error.code).toBe('unauthenticated');
  });

  it('lists both firms of a person who works for two, and switches between them', async () => {
    const ledger = ids.user('ledger@tallow-accounts.test');
    const s = await sessionFor(deps.db, ledger, tenantA);
    const me = await request(app).get('/api/v1/me').set(as(s)).expect(200);
    expect(me.body.memberships.map((m: { tenantId: string }) => m.tenantId).sort()).toEqual(
      [tenantA, tenantB].sort(),
    );
    expect(me.body.activeTenant.id).toBe(tenantA);
    expect(me.body.permissions).toContain('invoices:read');
    expect(me.body.permissions).not.toContain('margins:read');
    const switched = await request(app)
      .put('/api/v1/me/active-tenant')
      .set(as(s))
      .send({ tenantId: tenantB })
      .expect(200);
    expect(switched.body.activeTenant.name).toBe('Pennick & Daughters Flooring');
    const after = await request(app).get('/api/v1/me').set(as(s)).expect(200);
    expect(after.body.activeTenant.id).toBe(tenantB);
  });

  it('treats a firm the person does not belong to as not found', async () => {
    const crew = await sessionFor(deps.db, ids.user('crew@kestrel-floorworks.test'), tenantA);
    await request(app)
      .put('/api/v1/me/active-tenant')
      .set(as(crew))
      .send({ tenantId: tenantB })
      .expect(404);
  });

  it('refuses a state change without the session’s CSRF token', async () => {
    const res = await request(app)
      .put('/api/v1/me/active-tenant')
      .set('Cookie', owner.cookie)
      .send({ tenantId: tenantA })
      .expect(403);
    expect(res.body.error.message).toMatch(/security token/);
  });

  it('answers 401 once the session has expired', async () => {
    const s = await sessionFor(deps.db, ownerId, tenantA);
    await deps.db
      .updateTable('appSession')
      .set({ expire: new Date(Date.now() - 1000) })
      .where('sid', '=', s.sid)
      .execute();
    await request(app).get('/api/v1/me').set(as(s)).expect(401);
  });
});

describe('members', () => {
  it('invites a person by e-mail with a single-use password link at the identity provider', async () => {
    const email = `new-fitter-${Date.now()}@wexbridge-tiling.test`;
    const res = await request(app)
      .post('/api/v1/members/invitations')
      .set(as(owner))
      .send({ email, name: 'Nell Hazeldine', role: 'installer' })
      .expect(201);
    expect(res.body).toMatchObject({ email, role: 'installer', joinedAt: null });
    const [mail] = await waitForMessagesTo(email);
    expect(mail?.subject).toBe('You are invited to Kestrel Floorworks Ltd on Latchwork');
    expect(mail?.text).toContain(`${process.env['IDP_ISSUER']}/set-password/`);
    await request(app)
      .post('/api/v1/members/invitations')
      .set(as(owner))
      .send({ email, name: 'Nell Hazeldine', role: 'installer' })
      .expect(409);
  });

  it('names the field of a bad invitation', async () => {
    const res = await request(app)
      .post('/api/v1/members/invitations')
      .set(as(owner))
      .send({ email: 'not-an-address', name: 'X', role: 'installer' })
      .expect(400);
    expect(res.body.error.details.problems[0].path).toBe('email');
    const role = await request(app)
      .post('/api/v1/members/invitations')
      .set(as(owner))
      .send({ email: 'a@b.test', name: 'X', role: 'boss' })
      .expect(400);
    expect(role.body.error.message).toContain('role');
  });

  it('does not let the last owner be demoted or removed', async () => {
    const demote = await request(app)
      .patch(`/api/v1/members/${ownerId}`)
      .set(as(owner))
      .send({ role: 'estimator' })
      .expect(409);
    expect(demote.body.error.message).toMatch(/at least one owner/);
    await request(app).delete(`/api/v1/members/${ownerId}`).set(as(owner)).expect(409);
  });

  it('lets only one of two owners demote the other at the same moment', async () => {
    const second = await deps.db
      .insertInto('appUser')
      .values({ email: `co-owner-${Date.now()}@wexbridge-tiling.test`, name: 'Co Owner' })
      .returning('id')
      .executeTakeFirstOrThrow();
    await withTenant(deps.db, { tenantId: tenantA }, (tx) =>
      tx
        .insertInto('membership')
        .values({
          tenantId: tenantA,
          userId: second.id,
          role: 'owner',
          invitedBy: ownerId,
          joinedAt: new Date(),
        })
        .execute(),
    );
    const other = await sessionFor(deps.db, second.id, tenantA);
    const [x, y] = await Promise.all([
      request(app).patch(`/api/v1/members/${second.id}`).set(as(owner)).send({ role: 'estimator' }),
      request(app).patch(`/api/v1/members/${ownerId}`).set(as(other)).send({ role: 'estimator' }),
    ]);
    // The loser is refused either by the last-owner rule (409) or, if the winner's change
    // landed before its request began, because it is no longer an owner at all (403).
    const statuses = [x.status, y.status].sort();
    expect(statuses[0]).toBe(200);
    expect([403, 409]).toContain(statuses[1]);
    const owners = await withTenant(deps.db, { tenantId: tenantA }, (tx) =>
      tx
        .selectFrom('membership')
        .select('userId')
        .where('tenantId', '=', tenantA)
        .where('role', '=', 'owner')
        .execute(),
    );
    expect(owners).toHaveLength(1);
    // Put things back for the other tests.
    if (owners[0]?.userId !== ownerId) {
      await withTenant(deps.db, { tenantId: tenantA }, (tx) =>
        tx
          .updateTable('membership')
          .set({ role: 'owner' })
          .where('tenantId', '=', tenantA)
          .where('userId', '=', ownerId)
          .execute(),
      );
    }
    await withTenant(deps.db, { tenantId: tenantA }, (tx) =>
      tx
        .deleteFrom('membership')
        .where('tenantId', '=', tenantA)
        .where('userId', '=', second.id)
        .execute(),
    );
  });

  it('records role changes and settings changes in the audit log, which only the owner reads', async () => {
    const settings = (await request(app).get('/api/v1/settings').set(as(owner)).expect(200)).body;
    await request(app)
      .put('/api/v1/settings')
      .set(as(owner))
      .send({ ...settings, paymentTermsDays: settings.paymentTermsDays + 1 })
      .expect(200);
    await request(app).put('/api/v1/settings').set(as(owner)).send(settings).expect(200);
    const log = await request(app)
      .get('/api/v1/audit?action=settings-changed')
      .set(as(owner))
      .expect(200);
    expect(log.body[0]).toMatchObject({
      action: 'settings-changed',
      subject: 'paymentTermsDays',
      userEmail: 'owner@kestrel-floorworks.test',
    });
    expect(log.body[0].detail.paymentTermsDays).toEqual({
      from: settings.paymentTermsDays + 1,
      to: settings.paymentTermsDays,
    });
    const books = await sessionFor(deps.db, ids.user('books@kestrel-floorworks.test'), tenantA);
    await request(app).get('/api/v1/audit').set(as(books)).expect(403);
  });

  it('names the field of a bad settings change', async () => {
    const settings = (await request(app).get('/api/v1/settings').set(as(owner)).expect(200)).body;
    const res = await request(app)
      .put('/api/v1/settings')
      .set(as(owner))
      .send({ ...settings, currency: 'pounds' })
      .expect(400);
    expect(res.body.error.details.problems[0].path).toBe('currency');
  });
});
