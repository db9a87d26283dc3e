import request from 'supertest';
import type { Express } from 'express';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { withTenant } from '@latchwork/shared-db';
import { isPermission, ROLES, roleHas, type Role } from '@latchwork/shared-access';
import { routeAccess } from '../../apps/api/src/app';
import { signProviderEvent } from '@latchwork/identity-server';
import { createTestApi } from './api-harness';
import { demoIds, sessionFor } from './sessions';
import { FEATURE_WALKS } from './walker';

const { app, deps } = createTestApi();
afterAll(() => deps.close());

interface Route {
  method: string;
  path: string;
}

/** Every route of the Express router stack, nested routers included. */
function routesOf(express: Express): Route[] {
  const found = new Map<string, Route>();
  const walk = (
    stack: {
      route?: { path: string; methods: Record<string, boolean> };
      handle: { stack?: unknown[] };
      rawPath?: string;
    }[],
    prefix: string,
  ) => {
    for (const layer of stack) {
      if (layer.route) {
        for (const method of Object.keys(layer.route.methods)) {
          const route = { method: method.toUpperCase(), path: prefix + layer.route.path };
          found.set(`${route.method} ${route.path}`, route);
        }
      } else if (layer.handle.stack) {
        walk(
          layer.handle.stack as never,
          prefix +
            (typeof layer.rawPath === 'string' && layer.rawPath !== '/' ? layer.rawPath : ''),
        );
      }
    }
  };
  walk((express as unknown as { router: { stack: never[] } }).router.stack, '');
  return [...found.values()];
}

/** A valid body for each state-changing route, so a refusal cannot hide behind a 400. */
const SAMPLE_BODIES: Record<string, (firm: string, params: Record<string, string>) => object> = {
  'POST /api/v1/auth/logout': () => ({}),
  'POST /api/v1/auth/provider-events': () => ({
    type: 'sign-in-failed',
    email: 'nobody@nowhere.test',
    ipAddress: null,
    at: new Date().toISOString(),
  }),
  'PUT /api/v1/me/active-tenant': () => ({ tenantId: ids.tenantA }),
  'POST /api/v1/members/invitations': () => ({
    email: `walker-${Date.now()}-${Math.random().toString(36).slice(2)}@wexbridge-tiling.test`,
    name: 'Walker Target',
    role: 'installer',
  }),
  'POST /api/v1/members/:userId/invitation': () => ({}),
  'PATCH /api/v1/members/:userId': () => ({ role: 'stores' }),
  'POST /api/v1/takeoffs/compute': () => ({
    outline: [
      [0, 0],
      [3000, 0],
      [3000, 2000],
      [0, 2000],
    ],
    tile: { pitchMm: 500 },
  }),
  'PUT /api/v1/takeoffs/rates': () => ({}),
  'DELETE /api/v1/members/:userId': () => ({}),
  // A firm's own settings, unchanged: the walk must not rename anybody's firm.
  'PUT /api/v1/settings': (firm) => settingsOf.get(firm) ?? {},
  ...Object.assign({}, ...FEATURE_WALKS.map((w) => w.bodies)),
};

const ids = { tenantA: '', tenantB: '', targetUser: '' };
/** Route parameter values by name: the target member and each feature's objects in firm A. */
const params: Record<string, string> = {};
const settingsOf = new Map<string, object>();
let actorsA: { role: Role; userId: string }[];
let ownerB: string;
let nameA = '';
const ownerA = () => actorsA.find((a) => a.role === 'owner')?.userId ?? '';

beforeAll(async () => {
  const { tenant, user } = await demoIds(deps.db);
  const a = tenant('kestrel-floorworks');
  ids.tenantA = a.id;
  nameA = a.name;
  ids.tenantB = tenant('pennick-flooring').id;
  ownerB = user('owner@pennick-flooring.test');
  actorsA = [
    { role: 'owner', userId: user('owner@kestrel-floorworks.test') },
    { role: 'estimator', userId: user('estimator@kestrel-floorworks.test') },
    { role: 'stores', userId: user('stores@kestrel-floorworks.test') },
    { role: 'bookkeeper', userId: user('books@kestrel-floorworks.test') },
    { role: 'installer', userId: user('crew@kestrel-floorworks.test') },
  ];
  // A member of firm A who has not joined: the target of member routes, so the walk
  // removes or changes nobody the other tests rely on.
  const target = await deps.db
    .insertInto('appUser')
    .values({ email: `walker-target-${Date.now()}@wexbridge-tiling.test`, name: 'Walker Target' })
    .returning('id')
    .executeTakeFirstOrThrow();
  ids.targetUser = target.id;
  params['userId'] = target.id;
  await withTenant(deps.db, { tenantId: ids.tenantA }, (tx) =>
    tx
      .insertInto('membership')
      .values({
        tenantId: ids.tenantA,
        userId: target.id,
        role: 'installer',
        invitedBy: ownerA(),
        joinedAt: null,
      })
      .execute(),
  );
  for (const walk of FEATURE_WALKS)
    Object.assign(
      params,
      await walk.prepare({ db: deps.db, tenantA: ids.tenantA, ownerA: ownerA() }),
    );
  for (const [firm, owner] of [
    [ids.tenantA, ownerA()],
    [ids.tenantB, ownerB],
  ] as const) {
    const session = await sessionFor(deps.db, owner, firm);
    settingsOf.set(
      firm,
      (await request(app).get('/api/v1/settings').set('Cookie', session.cookie)).body,
    );
  }
});

async function call(route: Route, as?: { userId: string; tenantId: string }) {
  const path = route.path.replace(/:(\w+)/g, (_, name: string) => {
    const value = params[name];
    if (!value) throw new Error(`${route.method} ${route.path}: no walker value for :${name}`);
    return value;
  });
  const key = `${route.method} ${route.path}`;
  let req = request(app)[route.method.toLowerCase() as 'get'](path).redirects(0);
  if (as) {
    const session = await sessionFor(deps.db, as.userId, as.tenantId);
    req = req.set('Cookie', session.cookie).set('X-XSRF-TOKEN', session.csrfToken);
  }
  if (route.method !== 'GET') {
    const body = JSON.stringify(SAMPLE_BODIES[key]?.(as?.tenantId ?? ids.tenantA, params) ?? {});
    req = req.set('Content-Type', 'application/json');
    // The identity provider's event stream is public but signed; sign it as the provider would.
    if (key === 'POST /api/v1/auth/provider-events')
      req = req.set(
        'x-idp-signature',
        signProviderEvent(body, process.env['IDP_EVENT_SECRET'] ?? ''),
      );
    req = req.send(body);
  }
  return req;
}

describe('the route walker', () => {
  it('finds every route declared in the permission table, and only known permissions', () => {
    const access = routeAccess(deps);
    const routes = routesOf(app);
    expect(routes.length).toBeGreaterThan(10);
    for (const r of routes) {
      const permission = access.get(`${r.method} ${r.path}`);
      expect(
        permission,
        `${r.method} ${r.path} has no entry in the permission table`,
      ).toBeDefined();
      expect(
        permission === 'public' || permission === 'signed-in' || isPermission(permission ?? ''),
        `${r.method} ${r.path}: ${permission}`,
      ).toBe(true);
      if (r.method !== 'GET')
        expect(
          SAMPLE_BODIES[`${r.method} ${r.path}`],
          `${r.method} ${r.path} needs a sample body`,
        ).toBeDefined();
    }
  });

  it('gets the expected outcome for every route × actor', async () => {
    const access = routeAccess(deps);
    const unexpected: string[] = [];
    let tried = 0;
    // The owner goes last: its calls change or remove the target member.
    for (const route of routesOf(app)) {
      const permission = access.get(`${route.method} ${route.path}`) ?? 'undeclared';
      const label = `${route.method} ${route.path}`;
      const anonymous = await call(route);
      tried++;
      if (permission !== 'public' && anonymous.status !== 401)
        unexpected.push(`${label} anonymous → ${anonymous.status}, expected 401`);
      if (anonymous.status >= 500) unexpected.push(`${label} anonymous → ${anonymous.status}`);

      for (const actor of [...actorsA].reverse()) {
        const res = await call(route, { userId: actor.userId, tenantId: ids.tenantA });
        tried++;
        const allowed =
          permission === 'public' ||
          permission === 'signed-in' ||
          roleHas(actor.role, permission as never);
        if (allowed && (res.status === 401 || res.status === 403 || res.status >= 500))
          unexpected.push(`${label} as ${actor.role} → ${res.status}, expected access`);
        if (!allowed && res.status !== 403)
          unexpected.push(`${label} as ${actor.role} → ${res.status}, expected 403`);
      }

      // The owner of firm B holds every permission, in firm B: aimed at A's ids it must get 404,
      // and whatever it may read must hold nothing of firm A.
      const other = await call(route, { userId: ownerB, tenantId: ids.tenantB });
      tried++;
      if (route.path.includes(':') && other.status !== 404)
        unexpected.push(`${label} as firm B at firm A's id → ${other.status}, expected 404`);
      const body = JSON.stringify(other.body ?? '');
      if (body.includes(ids.tenantA) || body.includes(ids.targetUser) || body.includes(nameA))
        unexpected.push(`${label} as firm B leaks firm A's data`);
    }
    console.log(
      `route walker: ${routesOf(app).length} routes × ${2 + actorsA.length} actors = ${tried} calls, ${unexpected.length} unexpected`,
    );
    expect(unexpected).toEqual([]);
    // Over a hundred routes × seven actors, each call with a fresh session: well past the
    // default per-test limit on a busy two-core machine.
  }, 240_000);

  it('covers every role', () => {
    expect(actorsA.map((a) => a.role).sort()).toEqual([...ROLES].sort());
  });
});
