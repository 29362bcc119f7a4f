import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../helpers/test-app';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(() => t.close());

describe('request validation and the error shape', () => {
  it('a bad query parameter answers 400 naming the field', async () => {
    const u = await t.as('engineer@brannock.example');
    const res = await u.get(`/api/agencies/${t.ids.brannock}/segments?limit=abc&band=purple`);
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_request');
    const paths = res.body.error.issues.map((i: { path: string }) => i.path);
    expect(paths).toContain('query.limit');
    expect(paths.some((p: string) => p.startsWith('query.band'))).toBe(true);
  });

  it('a body with a wrong type or an unknown field answers 400 and writes nothing', async () => {
    const u = await t.as('engineer@brannock.example');
    const before = await u.get(`/api/agencies/${t.ids.brannock}/segments/1`);
    const res = await u
      .patch(`/api/agencies/${t.ids.brannock}/segments/1`)
      .send({ widthFt: 'wide', agencyId: 'other' });
    expect(res.status).toBe(400);
    const paths = res.body.error.issues.map((i: { path: string }) => i.path);
    expect(paths).toContain('body.widthFt');
    const after = await u.get(`/api/agencies/${t.ids.brannock}/segments/1`);
    expect(after.body).toEqual(before.body);
  });

  it('malformed JSON answers 400, never a stack trace', async () => {
    const u = await t.as('engineer@brannock.example');
    const res = await u
      .patch(`/api/agencies/${t.ids.brannock}/segments/1`)
      .set('Content-Type', 'application/json')
      .send('{"notes": ');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('entity.parse.failed');
    expect(JSON.stringify(res.body)).not.toMatch(/at .*\.ts|node_modules/);
  });

  it('a non-JSON body answers 415', async () => {
    const u = await t.as('engineer@brannock.example');
    const res = await u
      .patch(`/api/agencies/${t.ids.brannock}/segments/1`)
      .set('Content-Type', 'text/plain')
      .send('notes=x');
    expect(res.status).toBe(415);
  });

  it('a body over the 1 MB limit answers 413', async () => {
    const u = await t.as('engineer@brannock.example');
    const res = await u.patch(`/api/agencies/${t.ids.brannock}/segments/1`).send({ notes: 'x'.repeat(1_100_000) });
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe('entity.too.large');
  });

  it('an unknown API route answers 404 in JSON', async () => {
    const res = await t.anonymous().get('/api/no-such-thing');
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe('not_found');
  });
});

describe('security headers', () => {
  it('sends a CSP that keeps everything on this server and allows blob workers for the map', async () => {
    const res = await t.anonymous().get('/api/health');
    const csp = String(res.headers['content-security-policy']);
    expect(csp).toContain("default-src 'self'");
    expect(csp).toContain("worker-src 'self' blob:");
    expect(csp).toContain("frame-ancestors 'none'");
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['x-powered-by']).toBeUndefined();
  });
});

describe('API documentation', () => {
  it('the OpenAPI document lists every declared route with its schemas', async () => {
    const res = await t.anonymous().get('/api/openapi.json');
    expect(res.status).toBe(200);
    expect(res.body.openapi).toBe('3.1.0');
    for (const r of t.routes) {
      const p = r.path.replace(/:([A-Za-z]+)/g, '{$1}');
      expect(res.body.paths[p]?.[r.method], `${r.method} ${p}`).toBeDefined();
    }
    const list = res.body.paths['/api/agencies/{agencyId}/segments'].get;
    expect(list.parameters.map((p: { name: string }) => p.name)).toEqual(
      expect.arrayContaining(['agencyId', 'limit', 'offset', 'q', 'class', 'band']),
    );
  });

  it('serves a readable reference page', async () => {
    const res = await t.anonymous().get('/api/docs/');
    expect(res.status).toBe(200);
    expect(res.text).toContain('Wearcourse API reference');
  });
});
