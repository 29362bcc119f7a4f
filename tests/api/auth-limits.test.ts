// Account security details: rate limits keyed on the e-mail as the account look-up
// reads it, failed sign-ins only; a reset answer that does not tell whether the account
// exists; one reset link at a time; an invitation that cannot leave an agency without an admin.
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { APP_URL, createTestApp, type TestApp, tokenFrom } from '../helpers/test-app';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp({ signInRateLimit: 3 });
});
afterAll(() => t.close());

const post = (path: string, body: object) => request(t.app).post(path).set('Origin', APP_URL).send(body);
const mailsTo = (email: string) =>
  (t.sqlite.prepare('SELECT count(*) AS n FROM caught_mail WHERE to_address = ?').get(email) as { n: number }).n;
async function until<T>(f: () => T, ok: (v: T) => boolean, ms = 10_000) {
  const end = Date.now() + ms;
  for (;;) {
    const v = f();
    if (ok(v) || Date.now() > end) return v;
    await new Promise((r) => setTimeout(r, 50));
  }
}

describe('rate limits', () => {
  it('spaces and capitals in the e-mail share one budget with the plain address', async () => {
    const spellings = [
      'viewer@marlow.example',
      ' viewer@marlow.example',
      'VIEWER@Marlow.example ',
      '\tViewer@marlow.EXAMPLE',
    ];
    const statuses: number[] = [];
    for (const email of spellings)
      statuses.push((await post('/api/auth/sign-in/email', { email, password: 'wrong' })).status);
    expect(statuses).toEqual([401, 401, 401, 429]);
  });

  it('successful sign-ins are not counted', async () => {
    for (let i = 0; i < 6; i++)
      expect(
        (await post('/api/auth/sign-in/email', { email: ' Engineer@Marlow.example', password: 'wearcourse-demo' }))
          .status,
      ).toBe(200);
    expect((await post('/api/auth/sign-in/email', { email: 'engineer@marlow.example', password: 'x' })).status).toBe(
      401,
    );
  });

  it('reset requests under any spelling share one budget: at most the limit of mails reach the inbox', async () => {
    const before = mailsTo('admin@marlow.example');
    const statuses: number[] = [];
    for (const email of [
      'admin@marlow.example',
      ' ADMIN@marlow.example',
      'Admin@Marlow.Example ',
      'admin@MARLOW.example',
    ])
      statuses.push((await post('/api/auth/forgot-password', { email })).status);
    expect(statuses).toEqual([200, 200, 200, 429]);
    expect(
      await until(
        () => mailsTo('admin@marlow.example') - before,
        (n) => n >= 3,
      ),
    ).toBe(3);
  });
});

describe('forgot password', () => {
  it('answers an existing and an unknown account alike (status, body, headers); the mail still arrives', async () => {
    const fresh = await createTestApp();
    try {
      const ask = (email: string) =>
        request(fresh.app).post('/api/auth/forgot-password').set('Origin', APP_URL).send({ email });
      const known = await ask('engineer@brannock.example');
      const unknown = await ask('nobody-here@brannock.example');
      expect(known.status).toBe(200);
      expect(unknown.status).toBe(known.status);
      expect(unknown.text).toBe(known.text);
      const headers = (r: request.Response) =>
        Object.fromEntries(Object.entries(r.headers).filter(([k]) => k !== 'date'));
      expect(headers(unknown)).toEqual(headers(known));
      const mail = await until(
        () => fresh.lastMailTo('engineer@brannock.example'),
        (m) => !!m,
      );
      expect(mail?.subject).toMatch(/Reset your Wearcourse password/);
      expect(fresh.lastMailTo('nobody-here@brannock.example')).toBeUndefined();
    } finally {
      await fresh.close();
    }
  });

  it('an older reset link stops working once a newer one is used', async () => {
    const email = 'viewer@brannock.example';
    const ask = async () => {
      const before = t.lastMailTo(email)?.id ?? 0;
      await post('/api/auth/forgot-password', { email });
      const m = await until(
        () => t.lastMailTo(email),
        (x) => !!x && x.id !== before,
      );
      return tokenFrom(m!.textBody, 'reset-password');
    };
    const older = await ask();
    const newer = await ask();
    expect((await post('/api/auth/reset-password', { token: newer, password: 'the newer passphrase' })).status).toBe(
      200,
    );
    const stale = await post('/api/auth/reset-password', { token: older, password: 'the older passphrase' });
    expect(stale.status).toBe(400);
    expect(stale.body.error.code).toBe('invalid_token');
  });
});

describe('invitations and the last admin', () => {
  it('accepting a stale lower-role invitation leaves the only admin an admin', async () => {
    const admin = await t.as('admin@brannock.example');
    const base = `/api/agencies/${t.ids.brannock}`;
    const email = 'stale@brannock.example';
    await admin.post(`${base}/invitations`).send({ email, role: 'viewer' });
    const stale = tokenFrom(t.lastMailTo(email)!.textBody, 'invite');
    await admin.post(`${base}/invitations`).send({ email, role: 'admin' });
    const fresh = tokenFrom(t.lastMailTo(email)!.textBody, 'invite');
    expect(
      (await post(`/api/invitations/${fresh}/accept`, { name: 'Stale Test', password: 'a long passphrase' })).status,
    ).toBe(200);
    // The new admin demotes the old one: they are now the agency's only admin.
    const newAdmin = await t.as(email, 'a long passphrase');
    const oldId = (await admin.get('/api/me')).body.user.id;
    expect((await newAdmin.patch(`${base}/members/${oldId}`).send({ role: 'engineer' })).status).toBe(200);
    const res = await post(`/api/invitations/${stale}/accept`, { password: 'a long passphrase' });
    expect(res.status).toBe(200);
    expect(res.body.memberships.find((m: { agencyId: string }) => m.agencyId === t.ids.brannock).role).toBe('admin');
    const admins = t.sqlite
      .prepare("SELECT count(*) AS n FROM memberships WHERE agency_id = ? AND role = 'admin'")
      .get(t.ids.brannock) as { n: number };
    expect(admins.n).toBe(1);
  });
});
