import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApi } from './api-harness';
import { demoIds, sessionFor, type TestSession } from './sessions';

const { app, deps } = createTestApi();
afterAll(() => deps.close());

const as = (s: TestSession) => ({ Cookie: s.cookie, 'X-XSRF-TOKEN': s.csrfToken });
const garage = {
  outline: [
    [0, 0],
    [6000, 0],
    [6000, 6500],
    [0, 6500],
  ],
  tile: { pitchMm: 500 },
  gapMm: 5,
  origin: { x: 5, y: 5 },
};
let estimator: TestSession;
let owner: TestSession;

beforeAll(async () => {
  const ids = await demoIds(deps.db);
  // Firm B: its rates are changed below, and firm A's tests must not see that.
  const firm = ids.tenant('pennick-flooring').id;
  owner = await sessionFor(deps.db, ids.user('owner@pennick-flooring.test'), firm);
  // Firm B's demo staff is its owner alone; the estimator's access is covered by the route walker.
  estimator = owner;
});

describe('POST /api/v1/takeoffs/compute', () => {
  it('computes the worked example: a 6.0 × 6.5 m garage at 500 mm from a wall needs 156 tiles', async () => {
    // 13 × 12 whole and cut pieces per direction (worked example of counting pieces, from memory).
    const res = await request(app)
      .post('/api/v1/takeoffs/compute')
      .set(as(estimator))
      .send(garage)
      .expect(200);
    expect(res.body.tiles.full + res.body.tiles.cut).toBe(156);
    expect(res.body.netAreaM2).toBe(39);
    expect(res.body.plan.fullRuns.length).toBeGreaterThan(0);
  });

  it('names the field and the point of a crossing outline', async () => {
    const bowtie = {
      ...garage,
      outline: [
        [0, 0],
        [4000, 4000],
        [4000, 0],
        [0, 4000],
      ],
    };
    const res = await request(app)
      .post('/api/v1/takeoffs/compute')
      .set(as(estimator))
      .send(bowtie)
      .expect(400);
    expect(res.body.error.code).toBe('validation_failed');
    const problem = res.body.error.details.problems[0];
    expect(problem.path).toMatch(/^outline/);
    expect(problem.point).toHaveLength(2);
  });

  it('names the field of a pitch outside 100–1500 mm', async () => {
    const res = await request(app)
      .post('/api/v1/takeoffs/compute')
      .set(as(estimator))
      .send({ ...garage, tile: { pitchMm: 50 } })
      .expect(400);
    expect(res.body.error.details.problems.map((p: { path: string }) => p.path)).toContain(
      'tile.pitchMm',
    );
  });

  it('refuses a body of the wrong shape, naming the field', async () => {
    const res = await request(app)
      .post('/api/v1/takeoffs/compute')
      .set(as(estimator))
      .send({ ...garage, outline: 'square' })
      .expect(400);
    expect(res.body.error.details.problems[0].path).toBe('outline');
  });
});

describe('the firm’s takeoff rates', () => {
  it('start as the engine’s defaults, take the owner’s overrides, and feed the computation', async () => {
    const before = await request(app).get('/api/v1/takeoffs/rates').set(as(estimator)).expect(200);
    expect(before.body.effective.packSize).toBe(before.body.defaults.packSize);
    const put = await request(app)
      .put('/api/v1/takeoffs/rates')
      .set(as(owner))
      .send({ packSize: 12, overagePct: 0, gapMm: before.body.defaults.gapMm })
      .expect(200);
    // A value equal to the default is not kept as an override.
    expect(put.body.overrides).toEqual({ packSize: 12, overagePct: 0 });
    const res = await request(app)
      .post('/api/v1/takeoffs/compute')
      .set(as(estimator))
      .send(garage)
      .expect(200);
    expect(res.body.tiles.toOrder).toBe(156);
    expect(res.body.tiles.packs).toBe(13); // 156 tiles in boxes of 12
    await request(app).put('/api/v1/takeoffs/rates').set(as(owner)).send({}).expect(200);
  });

  it('refuses an unknown rate or a negative one', async () => {
    await request(app)
      .put('/api/v1/takeoffs/rates')
      .set(as(owner))
      .send({ packSizes: 12 })
      .expect(400);
    const res = await request(app)
      .put('/api/v1/takeoffs/rates')
      .set(as(owner))
      .send({ crewSize: -1 })
      .expect(400);
    expect(res.body.error.details.problems[0].path).toBe('crewSize');
  });
});
