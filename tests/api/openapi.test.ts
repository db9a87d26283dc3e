import request from 'supertest';
import { Validator } from '@seriousme/openapi-schema-validator';
import { afterAll, describe, expect, it } from 'vitest';
import { createTestApi } from './api-harness';

const { app, deps } = createTestApi();
afterAll(() => deps.close());

describe('the OpenAPI document', () => {
  it('is a valid OpenAPI 3.1 document covering the declared routes', async () => {
    const res = await request(app).get('/api/v1/openapi.json').expect(200);
    // Checked against the official OpenAPI 3.1 JSON schema by @seriousme/openapi-schema-validator.
    const result = await new Validator().validate(res.body);
    expect(result.errors ?? []).toEqual([]);
    expect(result.valid).toBe(true);
    expect(res.body.openapi).toBe('3.1.0');
    expect(Object.keys(res.body.paths)).toContain('/health');
    expect(
      res.body.paths['/health'].get.responses['200'].content['application/json'].schema.properties
        .checks,
    ).toBeTruthy();
  });

  it('has a browsable page served from the app itself', async () => {
    const page = await request(app).get('/api/v1/docs/').expect(200);
    expect(page.text).toContain('swagger-ui-bundle.js');
    expect(page.text).not.toMatch(/https?:\/\//);
    await request(app)
      .get('/api/v1/docs/swagger-ui-bundle.js')
      .expect(200)
      .expect('Content-Type', /javascript/);
    await request(app).get('/api/v1/docs/start.js').expect(200);
  });
});
