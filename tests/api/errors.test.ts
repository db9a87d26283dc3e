import express from 'express';
import request from 'supertest';
import { z } from 'zod';
import { afterAll, describe, expect, it } from 'vitest';
import { endpoint, errorHandler, notFoundHandler, routerFor } from '@latchwork/shared-server-kit';
import { createTestApi } from './api-harness';

const { app, deps } = createTestApi();
afterAll(() => deps.close());

const errorShape = { error: { code: expect.any(String), message: expect.any(String) } };

describe('one error shape for every error', () => {
  it('answers an unknown route with 404', async () => {
    const res = await request(app).get('/api/v1/no-such-thing').expect(404);
    expect(res.body).toMatchObject(errorShape);
    expect(res.body.error.code).toBe('not_found');
  });

  it('answers malformed JSON with 400', async () => {
    const res = await request(app)
      .post('/api/v1/health')
      .set('Content-Type', 'application/json')
      .send('{"outline": [1, 2,')
      .expect(400);
    expect(res.body.error.code).toBe('malformed_json');
  });

  it('answers a body over the limit with 413', async () => {
    const res = await request(app)
      .post('/api/v1/health')
      .set('Content-Type', 'application/json')
      .send(JSON.stringify({ pad: 'x'.repeat(1_100_000) }))
      .expect(413);
    expect(res.body.error.code).toBe('payload_too_large');
  });

  it('sets the usual security headers', async () => {
    const res = await request(app).get('/api/v1/openapi.json');
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['content-security-policy']).toContain("default-src 'self'");
    expect(res.headers['x-powered-by']).toBeUndefined();
  });
});

describe('the error handler with declared endpoints', () => {
  const probe = express();
  probe.use(express.json());
  probe.use(
    routerFor([
      endpoint({
        method: 'get',
        path: '/boom',
        summary: 'throws',
        tags: [],
        permission: 'public',
        handle() {
          throw new Error('secret detail at /srv/app/file.ts:12');
        },
      }),
      endpoint({
        method: 'post',
        path: '/tiles',
        summary: 'validates',
        tags: [],
        permission: 'public',
        body: z.object({ pitchMm: z.number().min(100).max(1500) }),
        handle: ({ body }) => body,
      }),
    ]),
  );
  probe.use(notFoundHandler);
  probe.use(errorHandler);

  it('turns a thrown error into a 500 without its message or stack', async () => {
    const res = await request(probe).get('/boom').expect(500);
    expect(res.body.error.code).toBe('internal');
    expect(JSON.stringify(res.body)).not.toContain('secret detail');
    expect(JSON.stringify(res.body)).not.toContain('file.ts');
  });

  it('names the field in a 400 for a bad body', async () => {
    const res = await request(probe).post('/tiles').send({ pitchMm: 50 }).expect(400);
    expect(res.body.error.code).toBe('validation_failed');
    expect(res.body.error.message).toContain('pitchMm');
    expect(res.body.error.details.problems[0].path).toBe('pitchMm');
  });
});
