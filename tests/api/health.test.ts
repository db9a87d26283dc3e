import request from 'supertest';
import { Redis } from 'ioredis';
import { afterAll, describe, expect, it } from 'vitest';
import { createApp } from '../../apps/api/src/app';
import { createTestApi } from './api-harness';

const { app, deps } = createTestApi();
afterAll(() => deps.close());

describe('GET /api/v1/health', () => {
  it('reports every dependency up, with its latency', async () => {
    const res = await request(app).get('/api/v1/health').expect(200);
    expect(res.body.status).toBe('up');
    for (const name of ['postgres', 'redis', 'objectStore', 'mail', 'payments']) {
      expect(res.body.checks[name], name).toMatchObject({ status: 'up' });
      expect(Number.isInteger(res.body.checks[name].latencyMs)).toBe(true);
    }
  });

  it('reports a dependency that cannot be reached as down, and the whole as degraded (503)', async () => {
    // A Redis client aimed at a port where nothing listens (9 is the discard port, unused here).
    const deadRedis = new Redis('redis://127.0.0.1:9', {
      maxRetriesPerRequest: 0,
      lazyConnect: true,
      retryStrategy: () => null,
    });
    deadRedis.on('error', () => undefined);
    const degraded = createApp({ ...deps, redis: deadRedis });
    const res = await request(degraded).get('/api/v1/health').expect(503);
    expect(res.body.status).toBe('degraded');
    expect(res.body.checks.redis.status).toBe('down');
    expect(res.body.checks.redis.error).toBeTruthy();
    expect(res.body.checks.postgres.status).toBe('up');
    deadRedis.disconnect();
  });

  it('echoes a request id header, or makes one', async () => {
    const given = await request(app)
      .get('/api/v1/openapi.json')
      .set('X-Request-Id', 'trace-abc-123');
    expect(given.headers['x-request-id']).toBe('trace-abc-123');
    const made = await request(app).get('/api/v1/openapi.json');
    expect(made.headers['x-request-id']).toMatch(/^[0-9a-f-]{36}$/);
  });
});
