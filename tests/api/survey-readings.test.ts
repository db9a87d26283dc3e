import request from 'supertest';
import Decimal from 'decimal.js';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApi } from './api-harness';
import { demoIds, sessionFor, type TestSession } from './sessions';
import { newFirm } from './walker/jobs';
import { createTestJob } from './walker/survey';

const { app, deps } = createTestApi();
afterAll(() => deps.close());

const as = (s: TestSession) => ({ Cookie: s.cookie, 'X-XSRF-TOKEN': s.csrfToken });
const tag = `${Date.now().toString(36)}${Math.random().toString(36).slice(2, 6)}`;
let estimator: TestSession;
let jobId = '';

beforeAll(async () => {
  const ids = await demoIds(deps.db);
  const tenantA = ids.tenant('kestrel-floorworks').id;
  const ownerId = ids.user('owner@kestrel-floorworks.test');
  estimator = await sessionFor(deps.db, ids.user('estimator@kestrel-floorworks.test'), tenantA);
  ({ jobId } = await createTestJob(deps.db, tenantA, ownerId, `Readings ${tag}`));
});

/** Records a reading on the test job and answers its verdict. */
async function verdict(
  kind: string,
  method: string,
  value: number,
  extra: object = {},
  job = jobId,
  session = estimator,
) {
  const res = await request(app)
    .post(`/api/v1/jobs/${job}/survey/readings`)
    .set(as(session))
    .send({ kind, method, value, takenAt: '2026-11-21T09:00:00Z', ...extra });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body as { status: string; message: string; source: string };
}

describe('readings judged at the default limits', () => {
  it('relative humidity: ≤ 75 % passes the limit but warns at it, fails above', async () => {
    // BS 8203 (hood hygrometer) and ASTM F2170 in-slab probes as summarised in ASTM F710
    // guidance: 75 % RH maximum. Our warn band is 5 % of the limit (71.25–75 %).
    expect((await verdict('relative_humidity', 'hood_hygrometer', 75)).status).toBe('warn');
    expect((await verdict('relative_humidity', 'in_slab_probe', 75.01)).status).toBe('fail');
    expect((await verdict('relative_humidity', 'hood_hygrometer', 71.2)).status).toBe('pass');
    const wet = await verdict('relative_humidity', 'in_slab_probe', 82);
    expect(wet.status).toBe('fail');
    expect(wet.message).toMatch(/82 %.*over the 75 % limit/);
    expect(wet.source).toMatch(/BS 8203/);
  });

  it('moisture emission: 3 lb/1000 ft²/24 h, also entered in g/m²/24 h', async () => {
    // ASTM F1869 calcium chloride test: 3 lb/1000 ft²/24 h maximum.
    expect((await verdict('moisture_emission', 'calcium_chloride', 3)).status).toBe('warn');
    expect((await verdict('moisture_emission', 'calcium_chloride', 3.01)).status).toBe('fail');
    // NIST SP 811 factors: 1 lb = 453.59237 g, 1 ft² = 0.09290304 m², so the limit is
    // 3 × 453.59237 / (1000 × 0.09290304) g/m²/24 h, worked out here with decimal.js.
    const limitG = new Decimal(3).times('453.59237').div(new Decimal(1000).times('0.09290304'));
    expect(limitG.toFixed(4)).toBe('14.6473');
    const under = limitG.minus('0.005').toDecimalPlaces(2).toNumber();
    const over = limitG.plus('0.005').toDecimalPlaces(2).toNumber();
    const g = { unit: 'g_per_m2_24h' };
    expect((await verdict('moisture_emission', 'calcium_chloride', under, g)).status).toBe('warn');
    const fail = await verdict('moisture_emission', 'calcium_chloride', over, g);
    expect(fail.status).toBe('fail');
    expect(fail.message).toContain(`${over} g/m²/24 h`);
  });

  it('surface regularity: SR2 = 5 mm under a 2 m straightedge', async () => {
    // BS 8204 surface regularity class SR2: 5 mm maximum gap under a 2 m straightedge.
    expect((await verdict('surface_regularity', 'straightedge_2m', 5)).status).toBe('warn');
    expect((await verdict('surface_regularity', 'straightedge_2m', 5.1)).status).toBe('fail');
    expect((await verdict('surface_regularity', 'straightedge_2m', 3)).status).toBe('pass');
  });

  it('air and slab temperature: 15 °C or more, warning up to 16 °C', async () => {
    // Interlocking PVC tiles are laid at 15 °C or more: common practice.
    expect((await verdict('air_temperature', 'thermometer', 15)).status).toBe('warn');
    expect((await verdict('air_temperature', 'thermometer', 14.9)).status).toBe('fail');
    expect((await verdict('air_temperature', 'thermometer', 16.5)).status).toBe('pass');
    const cold = await verdict('slab_temperature', 'infrared', 11);
    expect(cold.status).toBe('fail');
    expect(cold.source).toMatch(/common practice/);
  });

  it('names the field of a reading that cannot be judged', async () => {
    const wrongMethod = await request(app)
      .post(`/api/v1/jobs/${jobId}/survey/readings`)
      .set(as(estimator))
      .send({
        kind: 'relative_humidity',
        method: 'thermometer',
        value: 70,
        takenAt: '2026-11-21T09:00:00Z',
      });
    expect(wrongMethod.status).toBe(400);
    expect(wrongMethod.body.error.details.problems[0].path).toBe('method');
    const silly = await request(app)
      .post(`/api/v1/jobs/${jobId}/survey/readings`)
      .set(as(estimator))
      .send({
        kind: 'relative_humidity',
        method: 'hood_hygrometer',
        value: 140,
        takenAt: '2026-11-21T09:00:00Z',
      });
    expect(silly.status).toBe(400);
    expect(silly.body.error.details.problems[0].path).toBe('value');
  });
});

describe("a firm's own limits", () => {
  let firmOwner: TestSession;
  let firmJob = '';

  beforeAll(async () => {
    // A firm of its own, so changing its limits cannot disturb any other test.
    const firm = await newFirm(deps.db);
    firmOwner = await sessionFor(deps.db, firm.users.owner, firm.tenantId);
    ({ jobId: firmJob } = await createTestJob(deps.db, firm.tenantId, firm.users.owner));
  });

  it('lists the defaults with their sources and no overrides', async () => {
    const res = await request(app).get('/api/v1/survey/limits').set(as(firmOwner)).expect(200);
    expect(res.body.overrides).toEqual({});
    expect(res.body.effective.relative_humidity).toMatchObject({ bound: 'max', value: 75 });
    expect(res.body.defaults.moisture_emission.source).toMatch(/ASTM F1869/);
    expect(res.body.defaults.surface_regularity.source).toMatch(/BS 8204/);
  });

  it('judges new readings and the warnings by the override, named as the firm’s setting', async () => {
    expect(
      (await verdict('relative_humidity', 'hood_hygrometer', 77, {}, firmJob, firmOwner)).status,
    ).toBe('fail');
    const put = await request(app)
      .put('/api/v1/survey/limits')
      .set(as(firmOwner))
      .send({ relative_humidity: { value: 80 } })
      .expect(200);
    // 5 % band of the new value: warn from 76 %.
    expect(put.body.effective.relative_humidity).toMatchObject({ value: 80, warnMargin: 4 });
    const now = await verdict('relative_humidity', 'hood_hygrometer', 75.5, {}, firmJob, firmOwner);
    expect(now).toMatchObject({ status: 'pass', source: "firm's setting" });
    // The earlier 77 % reading is judged again by today's limit: a warning, no longer a failure.
    const survey = await request(app).get(`/api/v1/jobs/${firmJob}/survey`).set(as(firmOwner));
    expect(survey.body.surveyWarnings).toEqual([]);
    const first = survey.body.readings.find((r: { value: number }) => r.value === 77);
    expect(first).toMatchObject({ status: 'warn', recorded: { status: 'fail' } });
  });

  it('refuses a limit that cannot be met and a margin below zero', async () => {
    const zero = await request(app)
      .put('/api/v1/survey/limits')
      .set(as(firmOwner))
      .send({ surface_regularity: { value: 0 } });
    expect(zero.status).toBe(400);
    expect(zero.body.error.details.problems[0].path).toBe('surface_regularity.value');
    const negative = await request(app)
      .put('/api/v1/survey/limits')
      .set(as(firmOwner))
      .send({ air_temperature: { value: 15, warnMargin: -1 } });
    expect(negative.status).toBe(400);
  });
});
