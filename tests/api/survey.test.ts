import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { withTenant } from '@latchwork/shared-db';
import { computeTakeoff } from '@latchwork/takeoff';
import { surveyWarningsForJob } from '../../libs/jobs/server/src/survey/survey-warnings-for-job';
import { createTestApi } from './api-harness';
import { demoIds, sessionFor, type TestSession } from './sessions';
import { createTestJob } from './walker/survey';

const { app, deps } = createTestApi();
afterAll(() => deps.close());

const as = (s: TestSession) => ({ Cookie: s.cookie, 'X-XSRF-TOKEN': s.csrfToken });
const tag = Date.now().toString(36);
let tenantA = '';
let ownerId = '';
let owner: TestSession;
let estimator: TestSession;
let installer: TestSession;
let installerId = '';
let ownerB: TestSession;
let jobId = '';

/** The worked-example garage of the takeoff issue: 6.0 × 6.5 m, 5 mm gap, grid from a wall. */
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

beforeAll(async () => {
  const ids = await demoIds(deps.db);
  tenantA = ids.tenant('kestrel-floorworks').id;
  ownerId = ids.user('owner@kestrel-floorworks.test');
  owner = await sessionFor(deps.db, ownerId, tenantA);
  estimator = await sessionFor(deps.db, ids.user('estimator@kestrel-floorworks.test'), tenantA);
  installerId = ids.user('crew@kestrel-floorworks.test');
  installer = await sessionFor(deps.db, installerId, tenantA);
  const tenantB = ids.tenant('pennick-flooring').id;
  ownerB = await sessionFor(deps.db, ids.user('owner@pennick-flooring.test'), tenantB);
  ({ jobId } = await createTestJob(deps.db, tenantA, ownerId, `Survey CRUD ${tag}`));
});

describe('survey details and areas', () => {
  it('starts empty, saves details, and names a surveyor who is not a member', async () => {
    const empty = await request(app).get(`/api/v1/jobs/${jobId}/survey`).set(as(estimator));
    expect(empty.status).toBe(200);
    expect(empty.body).toMatchObject({ survey: null, areas: [], readings: [], surveyWarnings: [] });

    const details = {
      substrate: 'screed',
      surveyedAt: '2026-11-20T09:30:00.000Z',
      surveyorUserId: ownerId,
      notes: 'Power float finish; damp patch by the roller door.',
    };
    await request(app)
      .put(`/api/v1/jobs/${jobId}/survey`)
      .set(as(estimator))
      .send(details)
      .expect(200);
    const after = await request(app).get(`/api/v1/jobs/${jobId}/survey`).set(as(estimator));
    expect(after.body.survey).toMatchObject({ ...details, jobId });

    const stranger = await request(app)
      .put(`/api/v1/jobs/${jobId}/survey`)
      .set(as(estimator))
      .send({ ...details, surveyorUserId: '00000000-0000-4000-8000-000000000000' });
    expect(stranger.status).toBe(400);
    expect(stranger.body.error.details.problems[0].path).toBe('surveyorUserId');
  });

  it('adds and renames areas, refusing a second area of the same name', async () => {
    const bay = await request(app)
      .post(`/api/v1/jobs/${jobId}/survey/areas`)
      .set(as(estimator))
      .send({ name: 'Garage bay 1' })
      .expect(201);
    const dup = await request(app)
      .post(`/api/v1/jobs/${jobId}/survey/areas`)
      .set(as(estimator))
      .send({ name: 'garage BAY 1' });
    expect(dup.status).toBe(409);
    await request(app)
      .patch(`/api/v1/jobs/${jobId}/survey/areas/${bay.body.id}`)
      .set(as(estimator))
      .send({ name: 'Garage bay 2' })
      .expect(200);
    const survey = await request(app).get(`/api/v1/jobs/${jobId}/survey`).set(as(estimator));
    expect(survey.body.areas.map((a: { name: string }) => a.name)).toContain('Garage bay 2');
  });

  it('answers 404 to another firm, and to an installer until they are booked on the job', async () => {
    const b = await request(app).get(`/api/v1/jobs/${jobId}/survey`).set(as(ownerB));
    expect(b.status).toBe(404);
    const unbooked = await request(app).get(`/api/v1/jobs/${jobId}/survey`).set(as(installer));
    expect(unbooked.status).toBe(404);
    await withTenant(deps.db, { tenantId: tenantA }, (tx) =>
      tx.insertInto('jobCrew').values({ tenantId: tenantA, jobId, userId: installerId }).execute(),
    );
    const booked = await request(app).get(`/api/v1/jobs/${jobId}/survey`).set(as(installer));
    expect(booked.status).toBe(200);
  });
});

describe('takeoff versions', () => {
  let areaId = '';
  beforeAll(async () => {
    const res = await request(app)
      .post(`/api/v1/jobs/${jobId}/survey/areas`)
      .set(as(estimator))
      .send({ name: `Double garage ${tag}` })
      .expect(201);
    areaId = res.body.id;
  });

  it('stores what the engine computes for the same input with the rates it used', async () => {
    const saved = await request(app)
      .post(`/api/v1/jobs/${jobId}/survey/areas/${areaId}/versions`)
      .set(as(estimator))
      .send(garage)
      .expect(201);
    expect(saved.body.version).toBe(1);
    const stored = await request(app)
      .get(`/api/v1/jobs/${jobId}/survey/areas/${areaId}/versions/1`)
      .set(as(estimator))
      .expect(200);
    expect(stored.body.input).toEqual(garage);
    // Reference: the engine itself, which its own tests check against outside references
    // (a geometry library, brute-force clipping, NIST factors). Here we check the version
    // stores exactly its answer, drawing left out, with the firm's rates recorded.
    const { plan, ...expected } = computeTakeoff({ ...garage, rates: stored.body.rates } as never);
    expect(plan.fullRuns.length).toBeGreaterThan(0);
    expect(stored.body.summary).toEqual(JSON.parse(JSON.stringify(expected)));
    expect(stored.body.summary).not.toHaveProperty('plan');
    // 13 × 12 pieces when the grid starts at a wall (worked example, from memory).
    expect(stored.body.summary.tiles.full + stored.body.summary.tiles.cut).toBe(156);
  });

  it('numbers versions, lists them newest first and shows the latest on the survey', async () => {
    const wider = {
      ...garage,
      outline: [
        [0, 0],
        [7000, 0],
        [7000, 6500],
        [0, 6500],
      ],
    };
    const v2 = await request(app)
      .post(`/api/v1/jobs/${jobId}/survey/areas/${areaId}/versions`)
      .set(as(owner))
      .send(wider)
      .expect(201);
    expect(v2.body.version).toBe(2);
    const list = await request(app)
      .get(`/api/v1/jobs/${jobId}/survey/areas/${areaId}/versions`)
      .set(as(estimator))
      .expect(200);
    expect(list.body.map((v: { version: number }) => v.version)).toEqual([2, 1]);
    const survey = await request(app).get(`/api/v1/jobs/${jobId}/survey`).set(as(estimator));
    const area = survey.body.areas.find((a: { id: string }) => a.id === areaId);
    expect(area.latest.version).toBe(2);
    expect(area.latest.summary.netAreaM2).toBeCloseTo(45.5, 6);
  });

  it('refuses a crossing outline with the field named, and saves nothing', async () => {
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
      .post(`/api/v1/jobs/${jobId}/survey/areas/${areaId}/versions`)
      .set(as(estimator))
      .send(bowtie);
    expect(res.status).toBe(400);
    expect(res.body.error.details.problems[0].path).toMatch(/^outline/);
    const list = await request(app)
      .get(`/api/v1/jobs/${jobId}/survey/areas/${areaId}/versions`)
      .set(as(estimator));
    expect(list.body).toHaveLength(2);
  });

  it('keeps the area of another job out of reach through this job', async () => {
    const other = await createTestJob(deps.db, tenantA, ownerId);
    const res = await request(app)
      .get(`/api/v1/jobs/${other.jobId}/survey/areas/${areaId}/versions`)
      .set(as(estimator));
    expect(res.status).toBe(404);
  });

  it('writes the saved version on the job timeline', async () => {
    const events = await withTenant(deps.db, { tenantId: tenantA }, (tx) =>
      tx.selectFrom('jobEvent').select(['kind', 'summary']).where('jobId', '=', jobId).execute(),
    );
    const kinds = events.map((e) => e.kind);
    expect(kinds).toEqual(expect.arrayContaining(['survey-saved', 'area-added', 'takeoff-saved']));
    const saved = events.filter((e) => e.kind === 'takeoff-saved').map((e) => e.summary);
    expect(saved).toHaveLength(2);
    expect(saved.join('\n')).toMatch(/Takeoff v1 of "Double garage \w+" saved: 39\.0 m²/);
  });
});

describe('warnings on the job', () => {
  it('groups failed readings per kind with the worst value, the source and the caution', async () => {
    const { jobId: wet } = await createTestJob(deps.db, tenantA, ownerId, `Wet slab ${tag}`);
    const readings = [
      { kind: 'relative_humidity', method: 'in_slab_probe', value: 82, location: 'bay 2' },
      { kind: 'relative_humidity', method: 'hood_hygrometer', value: 78, location: 'bay 1' },
      { kind: 'relative_humidity', method: 'hood_hygrometer', value: 60, location: 'office' },
      { kind: 'slab_temperature', method: 'surface_probe', value: 11, location: 'bay 1' },
      { kind: 'air_temperature', method: 'thermometer', value: 17, location: 'bay 1' },
    ];
    for (const r of readings)
      await request(app)
        .post(`/api/v1/jobs/${wet}/survey/readings`)
        .set(as(estimator))
        .send({ ...r, takenAt: '2026-11-20T10:00:00Z' })
        .expect(201);
    const survey = await request(app).get(`/api/v1/jobs/${wet}/survey`).set(as(estimator));
    const warnings = survey.body.surveyWarnings;
    expect(warnings.map((w: { kind: string }) => w.kind)).toEqual([
      'relative_humidity',
      'slab_temperature',
    ]);
    expect(warnings[0]).toMatchObject({
      failed: 2,
      total: 3,
      worst: { value: 82, location: 'bay 2' },
    });
    expect(warnings[0].source).toMatch(/BS 8203/);
    expect(warnings[1].source).toMatch(/common practice/);
    expect(survey.body.caution).toMatch(/manufacturer's instructions and licensed practice govern/);
    // The function the quote will call agrees with what the job page shows.
    const direct = await withTenant(deps.db, { tenantId: tenantA }, (tx) =>
      surveyWarningsForJob(tx, { tenantId: tenantA }, wet),
    );
    expect(JSON.parse(JSON.stringify(direct.warnings))).toEqual(warnings);
    const events = await withTenant(deps.db, { tenantId: tenantA }, (tx) =>
      tx.selectFrom('jobEvent').select('summary').where('jobId', '=', wet).execute(),
    );
    expect(events.map((e) => e.summary)).toContain('Relative humidity 82 % at bay 2: fail');
  });

  it('removes a reading recorded by mistake, and its warning with it', async () => {
    const { jobId: cold } = await createTestJob(deps.db, tenantA, ownerId);
    const r = await request(app)
      .post(`/api/v1/jobs/${cold}/survey/readings`)
      .set(as(estimator))
      .send({
        kind: 'air_temperature',
        method: 'thermometer',
        value: 9,
        takenAt: '2026-11-20T08:00:00Z',
      })
      .expect(201);
    expect(r.body.status).toBe('fail');
    const before = await request(app).get(`/api/v1/jobs/${cold}/survey`).set(as(estimator));
    expect(before.body.surveyWarnings).toHaveLength(1);
    await request(app)
      .delete(`/api/v1/jobs/${cold}/survey/readings/${r.body.id}`)
      .set(as(estimator))
      .expect(200);
    const after = await request(app).get(`/api/v1/jobs/${cold}/survey`).set(as(estimator));
    expect(after.body.surveyWarnings).toEqual([]);
  });
});
