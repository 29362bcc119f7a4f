// The forecast routes: families in their response schema, a hand-set curve and
// going back to the fit, bad curves refused naming the field, roles and agencies kept apart.
import { and, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { type Family, FamilyListSchema } from '../../shared/schemas/forecast';
import { MIN_POINTS_TO_FIT } from '../../shared/engine/forecast/families';
import { auditLog } from '../../server/db/schema';
import { createTestApp, type TestApp } from '../helpers/test-app';

let t: TestApp;
let eng: Awaited<ReturnType<TestApp['as']>>;
let base: string;
beforeAll(async () => {
  t = await createTestApp();
  eng = await t.as('engineer@brannock.example');
  base = `/api/agencies/${t.ids.brannock}/forecast`;
});
afterAll(() => t.close());

const families = async (query = '') =>
  FamilyListSchema.parse((await eng.get(`${base}/families${query}`)).body).families;
const familyOf = async (key: string) => (await families()).find((f) => f.key === key) as Family;

describe('families', () => {
  it('answers in the family-list schema; a fitted family uses its own fit, a thin one the default', async () => {
    const res = await eng.get(`${base}/families`);
    expect(res.status).toBe(200);
    const list = FamilyListSchema.parse(res.body).families;
    expect(list.length).toBeGreaterThan(0);
    for (const f of list) {
      expect(f.key).toBe(`${f.surface}|${f.classGroup}|${f.treatmentGroup}`);
      expect(f.points).toHaveLength(f.n);
      if (f.source === 'fitted') {
        expect(f.n).toBeGreaterThanOrEqual(MIN_POINTS_TO_FIT);
        expect(f.curve).toEqual(f.fitted?.curve);
        expect(f.rmse).toBe(f.fitted?.rmse);
      } else {
        expect(f.source).toBe('default');
        expect(f.rmse).toBeNull();
      }
    }
    // Largest first.
    expect(list.map((f) => f.segments)).toEqual([...list.map((f) => f.segments)].sort((a, b) => b - a));
  });

  it('leaves the points out when asked, and names a bad query parameter', async () => {
    const [bare, full] = [await families('?points=false'), await families()];
    expect(bare.every((f) => f.points.length === 0)).toBe(true);
    // The same families and counts, only without the points.
    expect(bare).toEqual(full.map((f) => ({ ...f, points: [] })));
    const bad = await eng.get(`${base}/families?points=maybe`);
    expect(bad.status).toBe(400);
    expect(bad.body.error.issues.map((i: { path: string }) => i.path)).toEqual(['query.points']);
  });

  it('is for engineers of the agency only', async () => {
    const viewer = await t.as('viewer@brannock.example');
    expect((await viewer.get(`${base}/families`)).status).toBe(403);
    const foreign = await t.as('engineer@marlow.example');
    expect((await foreign.get(`${base}/families`)).status).toBe(404);
    expect((await t.anonymous().get(`${base}/families`)).status).toBe(401);
  });
});

describe('a hand-set curve', () => {
  it('replaces the fit until cleared, is audited both ways, and the fit comes back unchanged', async () => {
    const fitted = (await families()).find((f) => f.source === 'fitted')!;
    const curve = { p0: 97, a: 0.4, b: 1.8 };
    const put = await eng.put(`${base}/curves`).send({ familyKey: fitted.key, curve });
    expect(put.status).toBe(200);
    expect(put.body).toEqual({ ok: true });
    const edited = await familyOf(fitted.key);
    expect(edited).toMatchObject({ source: 'edited', curve, rmse: null, n: fitted.n });
    expect(edited.fitted).toEqual(fitted.fitted);

    const reset = await eng.put(`${base}/curves`).send({ familyKey: fitted.key, curve: null });
    expect(reset.status).toBe(200);
    expect(await familyOf(fitted.key)).toEqual(fitted);
    const actions = t.db
      .select({ action: auditLog.action })
      .from(auditLog)
      .where(and(eq(auditLog.entity, 'curve'), eq(auditLog.entityId, fitted.key)))
      .all()
      .map((r) => r.action);
    expect(actions).toEqual(['forecast.curve.edit', 'forecast.curve.reset']);
  });

  it('refuses a curve out of range naming each field in plain words, and writes nothing', async () => {
    const [first] = await families();
    const res = await eng.put(`${base}/curves`).send({ familyKey: first.key, curve: { p0: 120, a: 0, b: 5 } });
    expect(res.status).toBe(400);
    expect(
      Object.fromEntries(res.body.error.issues.map((i: { path: string; message: string }) => [i.path, i.message])),
    ).toEqual({
      'body.curve.p0': 'must be 0 to 100',
      'body.curve.a': 'must be more than 0',
      'body.curve.b': 'must be 1 to 3',
    });
    expect(await familyOf(first.key)).toEqual(first);
  });

  it('viewers cannot set a curve; another agency cannot either', async () => {
    const [first] = await families();
    const body = { familyKey: first.key, curve: { p0: 100, a: 1, b: 1.2 } };
    const viewer = await t.as('viewer@brannock.example');
    expect((await viewer.put(`${base}/curves`).send(body)).status).toBe(403);
    const foreign = await t.as('engineer@marlow.example');
    expect((await foreign.put(`${base}/curves`).send(body)).status).toBe(404);
    expect(await familyOf(first.key)).toEqual(first);
  });
});
