import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { APP_URL, createTestApp, type TestApp } from '../helpers/test-app';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp({ signInRateLimit: 5 });
});
afterAll(() => t.close());

describe('health', () => {
  it('answers without sign-in', async () => {
    const res = await request(t.app).get('/api/health');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ ok: true });
  });
});

describe('sign-in', () => {
  it('sets an HttpOnly, SameSite=Lax session cookie and returns the memberships', async () => {
    const res = await request(t.app)
      .post('/api/auth/sign-in/email')
      .set('Origin', APP_URL)
      .send({ email: 'consultant@example.com', password: 'wearcourse-demo' });
    expect(res.status).toBe(200);
    const cookie = String(res.headers['set-cookie']);
    expect(cookie).toMatch(/^wearcourse\.sid=/);
    expect(cookie).toMatch(/HttpOnly/);
    expect(cookie).toMatch(/SameSite=Lax/);
    expect(cookie).not.toMatch(/Secure/); // plain http on loopback
    expect(res.body.user.email).toBe('consultant@example.com');
    expect(
      res.body.memberships.map((m: { agencyName: string; role: string }) => `${m.agencyName}:${m.role}`).sort(),
    ).toEqual(['Brannock County:engineer', 'City of Marlow:engineer']);
  });

  it('answers 401 for a wrong password and for an unknown account, with the same message', async () => {
    const wrong = await request(t.app)
      .post('/api/auth/sign-in/email')
      .set('Origin', APP_URL)
      .send({ email: 'viewer@brannock.example', password: 'nope' });
    const unknown = await request(t.app)
      .post('/api/auth/sign-in/email')
      .set('Origin', APP_URL)
      .send({ email: 'nobody@brannock.example', password: 'nope' });
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(wrong.body.error.message).toBe(unknown.body.error.message);
    expect(wrong.headers['set-cookie']).toBeUndefined();
  });

  it('/api/me answers 401 when signed out', async () => {
    const res = await request(t.app).get('/api/me');
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe('unauthorized');
  });

  it('gives a new session id on each sign-in (no session fixation)', async () => {
    const agent = request.agent(t.app);
    const a = await agent
      .post('/api/auth/sign-in/email')
      .set('Origin', APP_URL)
      .send({ email: 'engineer@brannock.example', password: 'wearcourse-demo' });
    const b = await agent
      .post('/api/auth/sign-in/email')
      .set('Origin', APP_URL)
      .send({ email: 'engineer@brannock.example', password: 'wearcourse-demo' });
    const sid = (r: request.Response) => String(r.headers['set-cookie']).match(/wearcourse\.sid=([^;]+)/)?.[1];
    expect(sid(a)).toBeTruthy();
    expect(sid(b)).toBeTruthy();
    expect(sid(a)).not.toBe(sid(b));
  });

  it('sign-out ends the session on the server: the old cookie no longer works', async () => {
    const res = await request(t.app)
      .post('/api/auth/sign-in/email')
      .set('Origin', APP_URL)
      .send({ email: 'viewer@brannock.example', password: 'wearcourse-demo' });
    const cookie = String(res.headers['set-cookie']).split(';')[0];
    expect((await request(t.app).get('/api/me').set('Cookie', cookie)).status).toBe(200);
    const out = await request(t.app).post('/api/auth/sign-out').set('Origin', APP_URL).set('Cookie', cookie);
    expect(out.status).toBe(200);
    expect((await request(t.app).get('/api/me').set('Cookie', cookie)).status).toBe(401);
  });

  it('refuses demo accounts when NODE_ENV=production', async () => {
    const prod = await createTestApp({ env: 'production' });
    try {
      const res = await request(prod.app)
        .post('/api/auth/sign-in/email')
        .set('Origin', APP_URL)
        .send({ email: 'admin@brannock.example', password: 'wearcourse-demo' });
      expect(res.status).toBe(401);
      expect(res.body.error.message).toMatch(/demo accounts are disabled/i);
    } finally {
      await prod.close();
    }
  });
});

describe('CSRF defence (origin check)', () => {
  it('refuses a state-changing request without an Origin or from another site', async () => {
    const none = await request(t.app)
      .post('/api/auth/sign-in/email')
      .send({ email: 'viewer@brannock.example', password: 'wearcourse-demo' });
    expect(none.status).toBe(403);
    expect(none.body.error.code).toBe('bad_origin');
    const evil = await request(t.app)
      .post('/api/auth/sign-in/email')
      .set('Origin', 'http://evil.example')
      .send({ email: 'viewer@brannock.example', password: 'wearcourse-demo' });
    expect(evil.status).toBe(403);
  });
});

describe('rate limit on sign-in', () => {
  it('answers 429 after the configured number of attempts for one account', async () => {
    const statuses: number[] = [];
    for (let i = 0; i < 7; i++) {
      const res = await request(t.app)
        .post('/api/auth/sign-in/email')
        .set('Origin', APP_URL)
        .send({ email: 'admin@marlow.example', password: `wrong-${i}` });
      statuses.push(res.status);
    }
    expect(statuses.slice(0, 5)).toEqual([401, 401, 401, 401, 401]);
    expect(statuses.slice(5)).toEqual([429, 429]);
    // Another account from the same address is not locked out.
    const other = await request(t.app)
      .post('/api/auth/sign-in/email')
      .set('Origin', APP_URL)
      .send({ email: 'engineer@marlow.example', password: 'wearcourse-demo' });
    expect(other.status).toBe(200);
  });
});
