import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, tokenFrom, type TestApp } from '../helpers/test-app';

let t: TestApp;
// The reset mail goes out after the answer (the answer must not wait on the look-up or the send).
async function mailTo(email: string, after = 0) {
  for (let i = 0; i < 200; i++) {
    const m = t.lastMailTo(email);
    if (m && m.id > after) return m;
    await new Promise((r) => setTimeout(r, 25));
  }
  throw new Error(`no mail to ${email}`);
}
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(() => t.close());

describe('password reset', () => {
  it('mails a single-use link; the new password works, the old one and old sessions do not', async () => {
    const oldSession = await t.as('engineer@marlow.example');
    const res = await t.anonymous().post('/api/auth/forgot-password').send({ email: 'engineer@marlow.example' });
    expect(res.status).toBe(200);
    const mail = await mailTo('engineer@marlow.example');
    expect(mail?.subject).toMatch(/reset/i);
    expect(mail?.agencyId).toBeNull();
    const token = tokenFrom(mail!.textBody, 'reset-password');

    const done = await t
      .anonymous()
      .post('/api/auth/reset-password')
      .send({ token, password: 'new marlow passphrase' });
    expect(done.status).toBe(200);
    expect((await oldSession.get('/api/me')).status).toBe(401);
    await expect(t.as('engineer@marlow.example')).rejects.toThrow(/401/);
    const fresh = await t.as('engineer@marlow.example', 'new marlow passphrase');
    expect((await fresh.get('/api/me')).status).toBe(200);

    const reuse = await t
      .anonymous()
      .post('/api/auth/reset-password')
      .send({ token, password: 'yet another passphrase' });
    expect(reuse.status).toBe(400);
    expect(reuse.body.error.code).toBe('invalid_token');
  });

  it('an expired link is refused', async () => {
    await t.anonymous().post('/api/auth/forgot-password').send({ email: 'viewer@brannock.example' });
    const token = tokenFrom((await mailTo('viewer@brannock.example')).textBody, 'reset-password');
    t.sqlite.prepare("UPDATE password_resets SET expires_at = '2000-01-01T00:00:00.000Z' WHERE used_at IS NULL").run();
    const res = await t.anonymous().post('/api/auth/reset-password').send({ token, password: 'expired passphrase x' });
    expect(res.status).toBe(400);
  });

  it('answers the same for an unknown address and sends nothing', async () => {
    const res = await t.anonymous().post('/api/auth/forgot-password').send({ email: 'nobody@nowhere.example' });
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ ok: true });
    // Give the background look-up time to (not) send.
    await new Promise((r) => setTimeout(r, 300));
    expect(t.lastMailTo('nobody@nowhere.example')).toBeUndefined();
  });

  it('validates the new password length, naming the field', async () => {
    const res = await t
      .anonymous()
      .post('/api/auth/reset-password')
      .send({ token: 'x'.repeat(43), password: 'short' });
    expect(res.status).toBe(400);
    expect(res.body.error.issues.map((i: { path: string }) => i.path)).toContain('body.password');
  });
});
