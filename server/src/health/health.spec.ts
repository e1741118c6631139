import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../testing/test-app.js';

describe('health and API basics', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(() => t.close());

  it('answers ok without signing in', async () => {
    const res = await t.http.get('/api/health').expect(200);
    expect(res.body).toEqual({ status: 'ok' });
  });

  it('answers unknown API paths with a JSON 404', async () => {
    const res = await t.http.get('/api/no-such-thing').expect(404);
    expect(res.body.message).toMatch(/No such API route/);
  });

  it('serves the OpenAPI document', async () => {
    const res = await t.http.get('/api/docs-json').expect(200);
    expect(res.body.info.title).toBe('Stormhour API');
    expect(Object.keys(res.body.paths)).toContain('/api/blocks/import');
  });

  it('sets security headers', async () => {
    const res = await t.http.get('/api/health');
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['content-security-policy']).toContain("default-src 'self'");
    expect(res.headers['x-powered-by']).toBeUndefined();
  });
});
