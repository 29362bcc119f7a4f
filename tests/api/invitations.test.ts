import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, tokenFrom, type TestApp } from '../helpers/test-app';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(() => t.close());

describe('invitations', () => {
  it('admin invites by e-mail; the link from the caught mail creates a working account with that role', async () => {
    const admin = await t.as('admin@brannock.example');
    const res = await admin
      .post(`/api/agencies/${t.ids.brannock}/invitations`)
      .send({ email: 'New.Hire@Brannock.example', role: 'engineer' });
    expect(res.status).toBe(201);
    const mail = t.lastMailTo('new.hire@brannock.example');
    expect(mail?.subject).toMatch(/Brannock County/);
    expect(mail?.agencyId).toBe(t.ids.brannock);
    const token = tokenFrom(mail!.textBody, 'invite');

    const anon = t.anonymous();
    const info = await anon.get(`/api/invitations/${token}`);
    expect(info.body).toMatchObject({
      agencyName: 'Brannock County',
      email: 'new.hire@brannock.example',
      role: 'engineer',
      hasAccount: false,
    });

    const accepted = await anon
      .post(`/api/invitations/${token}/accept`)
      .send({ name: 'New Hire', password: 'a long enough passphrase' });
    expect(accepted.status).toBe(200);
    expect(accepted.body.memberships).toEqual([
      { agencyId: t.ids.brannock, agencyName: 'Brannock County', role: 'engineer' },
    ]);
    // The same agent is now signed in.
    expect((await anon.get(`/api/agencies/${t.ids.brannock}/segments?limit=1`)).status).toBe(200);
    // And the password works for a fresh sign-in.
    const again = await t.as('new.hire@brannock.example', 'a long enough passphrase');
    expect((await again.get('/api/me')).body.user.name).toBe('New Hire');
    // The token works once.
    expect((await t.anonymous().get(`/api/invitations/${token}`)).status).toBe(404);
    expect(
      (await t.anonymous().post(`/api/invitations/${token}/accept`).send({ name: 'X', password: 'another passphrase' }))
        .status,
    ).toBe(404);
  });

  it('an existing account joins a second agency only with its own password', async () => {
    const marlowAdmin = await t.as('admin@marlow.example');
    await marlowAdmin
      .post(`/api/agencies/${t.ids.marlow}/invitations`)
      .send({ email: 'viewer@brannock.example', role: 'viewer' });
    const token = tokenFrom(t.lastMailTo('viewer@brannock.example')!.textBody, 'invite');
    const info = await t.anonymous().get(`/api/invitations/${token}`);
    expect(info.body.hasAccount).toBe(true);
    const wrong = await t.anonymous().post(`/api/invitations/${token}/accept`).send({ password: 'not-the-password' });
    expect(wrong.status).toBe(401);
    const ok = await t.anonymous().post(`/api/invitations/${token}/accept`).send({ password: 'wearcourse-demo' });
    expect(ok.status).toBe(200);
    expect(ok.body.memberships.map((m: { agencyName: string }) => m.agencyName).sort()).toEqual([
      'Brannock County',
      'City of Marlow',
    ]);
  });

  it('a new account needs a name and a 10-character password', async () => {
    const admin = await t.as('admin@brannock.example');
    await admin
      .post(`/api/agencies/${t.ids.brannock}/invitations`)
      .send({ email: 'short@brannock.example', role: 'viewer' });
    const token = tokenFrom(t.lastMailTo('short@brannock.example')!.textBody, 'invite');
    const short = await t.anonymous().post(`/api/invitations/${token}/accept`).send({ name: 'S', password: 'short' });
    expect(short.status).toBe(400);
    expect(short.body.error.issues[0].path).toBe('body.password');
    const noName = await t
      .anonymous()
      .post(`/api/invitations/${token}/accept`)
      .send({ password: 'long enough password' });
    expect(noName.status).toBe(400);
    expect(noName.body.error.issues[0].path).toBe('body.name');
  });

  it('refuses to invite an existing member, and engineers and viewers cannot invite', async () => {
    const admin = await t.as('admin@brannock.example');
    const dup = await admin
      .post(`/api/agencies/${t.ids.brannock}/invitations`)
      .send({ email: 'engineer@brannock.example', role: 'viewer' });
    expect(dup.status).toBe(409);
    const eng = await t.as('engineer@brannock.example');
    expect(
      (await eng.post(`/api/agencies/${t.ids.brannock}/invitations`).send({ email: 'x@y.example', role: 'viewer' }))
        .status,
    ).toBe(403);
    const viewer = await t.as('viewer@brannock.example');
    expect(
      (await viewer.post(`/api/agencies/${t.ids.brannock}/invitations`).send({ email: 'x@y.example', role: 'viewer' }))
        .status,
    ).toBe(403);
  });

  it('a withdrawn invitation no longer opens', async () => {
    const admin = await t.as('admin@brannock.example');
    const res = await admin
      .post(`/api/agencies/${t.ids.brannock}/invitations`)
      .send({ email: 'withdrawn@brannock.example', role: 'viewer' });
    const token = tokenFrom(t.lastMailTo('withdrawn@brannock.example')!.textBody, 'invite');
    const list = await admin.get(`/api/agencies/${t.ids.brannock}/members`);
    expect(list.body.invitations.some((i: { email: string }) => i.email === 'withdrawn@brannock.example')).toBe(true);
    expect((await admin.delete(`/api/agencies/${t.ids.brannock}/invitations/${res.body.id}`)).status).toBe(200);
    expect((await t.anonymous().get(`/api/invitations/${token}`)).status).toBe(404);
  });

  it('keeps at least one admin', async () => {
    const admin = await t.as('admin@marlow.example');
    const me = (await admin.get('/api/me')).body.user.id;
    const res = await admin.patch(`/api/agencies/${t.ids.marlow}/members/${me}`).send({ role: 'viewer' });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('last_admin');
  });

  it('sent mail shows only the agency’s own messages', async () => {
    const brannockAdmin = await t.as('admin@brannock.example');
    const mail = await brannockAdmin.get(`/api/agencies/${t.ids.brannock}/sent-mail`);
    expect(mail.body.enabled).toBe(true);
    const recipients = mail.body.items.map((m: { toAddress: string }) => m.toAddress);
    expect(recipients).toContain('new.hire@brannock.example');
    // The Marlow invitation to the Brannock viewer belongs to Marlow.
    expect(mail.body.items.every((m: { subject: string }) => !m.subject.includes('Marlow'))).toBe(true);
  });
});
