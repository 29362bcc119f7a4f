// Permission matrix: each role × read/write × own/foreign agency, and signed out.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../helpers/test-app';

let t: TestApp;
let brannock: string;
let marlow: string;
let brannockSegment: number;
let marlowSegment: number;

beforeAll(async () => {
  t = await createTestApp();
  brannock = t.ids.brannock;
  marlow = t.ids.marlow;
  const admin = await t.as('admin@brannock.example');
  brannockSegment = (await admin.get(`/api/agencies/${brannock}/segments?limit=1`)).body.items[0].id;
  const marlowAdmin = await t.as('admin@marlow.example');
  marlowSegment = (await marlowAdmin.get(`/api/agencies/${marlow}/segments?limit=1`)).body.items[0].id;
});
afterAll(() => t.close());

type Case = { role: string; email: string; read: number; write: number; admin: number };
const brannockCases: Case[] = [
  { role: 'admin', email: 'admin@brannock.example', read: 200, write: 200, admin: 200 },
  { role: 'engineer', email: 'engineer@brannock.example', read: 200, write: 200, admin: 403 },
  { role: 'viewer', email: 'viewer@brannock.example', read: 200, write: 403, admin: 403 },
];

describe.each(brannockCases)('Brannock $role', (c) => {
  it(`reads own segments → ${c.read}`, async () => {
    const u = await t.as(c.email);
    const res = await u.get(`/api/agencies/${brannock}/segments?limit=5`);
    expect(res.status).toBe(c.read);
    expect(res.body.total).toBe(1224);
  });
  it(`writes an own segment → ${c.write}`, async () => {
    const u = await t.as(c.email);
    const res = await u
      .patch(`/api/agencies/${brannock}/segments/${brannockSegment}`)
      .send({ notes: `checked by ${c.role}` });
    expect(res.status).toBe(c.write);
    if (c.write === 403) expect(res.body.error.code).toBe('forbidden');
  });
  it(`reads own members (admin area) → ${c.admin}`, async () => {
    const u = await t.as(c.email);
    expect((await u.get(`/api/agencies/${brannock}/members`)).status).toBe(c.admin);
  });
  it('reads a foreign agency → 404, not 403', async () => {
    const u = await t.as(c.email);
    const res = await u.get(`/api/agencies/${marlow}/segments`);
    expect(res.status).toBe(404);
    expect(JSON.stringify(res.body)).not.toMatch(/Marlow/);
  });
  it('writes a foreign agency → 404', async () => {
    const u = await t.as(c.email);
    const res = await u.patch(`/api/agencies/${marlow}/segments/${marlowSegment}`).send({ notes: 'x' });
    expect(res.status).toBe(404);
  });
  it('cannot reach a foreign segment through its own agency id', async () => {
    const u = await t.as(c.email);
    expect((await u.get(`/api/agencies/${brannock}/segments/${marlowSegment}`)).status).toBe(404);
  });
});

describe('an agency that does not exist', () => {
  it('answers 404 exactly like a foreign one', async () => {
    const u = await t.as('admin@brannock.example');
    const missing = await u.get('/api/agencies/00000000-0000-0000-0000-000000000000/segments');
    const foreign = await u.get(`/api/agencies/${marlow}/segments`);
    expect(missing.status).toBe(404);
    expect(missing.body).toEqual(foreign.body);
  });
});

describe('consultant in two agencies', () => {
  it('reads both, and each list holds only that agency’s segments', async () => {
    const u = await t.as('consultant@example.com');
    const a = await u.get(`/api/agencies/${brannock}/segments?limit=1000`);
    const b = await u.get(`/api/agencies/${marlow}/segments?limit=1000`);
    expect(a.status).toBe(200);
    expect(b.status).toBe(200);
    expect(a.body.items.every((s: { segmentId: string }) => !s.segmentId.startsWith('MW-'))).toBe(true);
    expect(b.body.items.every((s: { segmentId: string }) => s.segmentId.startsWith('MW-'))).toBe(true);
    expect(b.body.total).toBe(84);
  });
});

describe('signed out', () => {
  it('answers 401 to reads and writes of agency data', async () => {
    const anon = t.anonymous();
    expect((await anon.get(`/api/agencies/${brannock}/segments`)).status).toBe(401);
    expect(
      (await anon.patch(`/api/agencies/${brannock}/segments/${brannockSegment}`).send({ notes: 'x' })).status,
    ).toBe(401);
    expect((await anon.get(`/api/agencies/${marlow}/members`)).status).toBe(401);
  });
});

describe('edits are audited', () => {
  it('records who changed what, before and after', async () => {
    const u = await t.as('engineer@brannock.example');
    await u.patch(`/api/agencies/${brannock}/segments/${brannockSegment}`).send({ widthFt: 23.5 });
    const row = t.sqlite
      .prepare("SELECT * FROM audit_log WHERE action = 'segment.update' ORDER BY id DESC LIMIT 1")
      .get() as { agency_id: string; detail: string };
    expect(row.agency_id).toBe(brannock);
    expect(JSON.parse(row.detail).widthFt.after).toBe(23.5);
  });
});
