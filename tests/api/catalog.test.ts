// Every catalog route: the answer matches its response schema, bad input is
// refused naming the field (and writes nothing), roles and agencies are kept apart.
import { and, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  CatalogSchema,
  EconomicsSchema,
  type Mix,
  MixSchema,
  PriceHistorySchema,
  type Treatment,
  TreatmentSchema,
} from '../../shared/schemas/catalog';
import { auditLog } from '../../server/db/schema';
import { createTestApp, type TestApp } from '../helpers/test-app';

let t: TestApp;
let admin: Awaited<ReturnType<TestApp['as']>>;
let eng: Awaited<ReturnType<TestApp['as']>>;
let base: string;
beforeAll(async () => {
  t = await createTestApp();
  admin = await t.as('admin@brannock.example');
  eng = await t.as('engineer@brannock.example');
  base = `/api/agencies/${t.ids.brannock}/catalog`;
});
afterAll(() => t.close());

const inputOf = <T extends { id: string; isDemo: boolean }>({ id: _id, isDemo: _demo, ...rest }: T) => rest;
const catalog = async () => CatalogSchema.parse((await admin.get(base)).body);
const mixNamed = async (name: string) => (await catalog()).mixes.find((m) => m.name === name) as Mix;
const treatmentNamed = async (name: string) => (await catalog()).treatments.find((x) => x.name === name) as Treatment;
const historyCount = async () => PriceHistorySchema.parse((await admin.get(`${base}/price-history`)).body).items.length;
const issuePaths = (body: { error: { issues?: { path: string; message: string }[] } }) =>
  Object.fromEntries((body.error.issues ?? []).map((i) => [i.path, i.message]));

describe('reading the catalog', () => {
  it('answers a viewer with mixes, treatments and economics in the catalog schema', async () => {
    const viewer = await t.as('viewer@brannock.example');
    const res = await viewer.get(base);
    expect(res.status).toBe(200);
    const c = CatalogSchema.parse(res.body);
    expect(c.mixes.map((m) => m.name)).toContain('Dense-graded 12.5 mm');
    expect(c.treatments.find((x) => x.name === 'Crack seal')?.costItems).toEqual([
      { label: 'Crack sealing', basis: 'per_sy', amount: 0.4 },
    ]);
  });

  it('keeps the price history from viewers and every route from another agency', async () => {
    const viewer = await t.as('viewer@brannock.example');
    expect((await viewer.get(`${base}/price-history`)).status).toBe(403);
    const foreign = await t.as('admin@marlow.example');
    expect((await foreign.get(base)).status).toBe(404);
    expect((await foreign.get(`${base}/price-history`)).status).toBe(404);
    const dense = await mixNamed('Dense-graded 12.5 mm');
    expect((await foreign.put(`${base}/mixes/${dense.id}`).send(inputOf(dense))).status).toBe(404);
  });
});

describe('mixes', () => {
  it('a price change is kept with its effective date, loses the demo tag, and is audited', async () => {
    const before = await mixNamed('Polymer-modified 12.5 mm');
    const res = await admin
      .put(`${base}/mixes/${before.id}`)
      .send({ ...inputOf(before), pricePerTon: 85.25, refLifeYears: 16, priceEffectiveDate: '2027-04-01' });
    expect(res.status).toBe(200);
    expect(MixSchema.parse(res.body)).toMatchObject({ pricePerTon: 85.25, refLifeYears: 16, isDemo: false });
    const hist = PriceHistorySchema.parse((await eng.get(`${base}/price-history`)).body).items;
    const mine = hist.filter((h) => h.entityId === before.id);
    expect(mine.map((h) => [h.field, h.before, h.after, h.effectiveDate])).toEqual([
      ['refLifeYears', 15, 16, '2027-04-01'],
      ['pricePerTon', 83, 85.25, '2027-04-01'],
    ]);
    expect(mine[0].userName).toBe('Dana Whitlock');
    const audit = t.db
      .select()
      .from(auditLog)
      .where(and(eq(auditLog.action, 'catalog.mix.update'), eq(auditLog.entityId, before.id)))
      .all();
    expect(audit).toHaveLength(1);
  });

  it('refuses a negative price naming the field in plain words, and writes nothing', async () => {
    const dense = await mixNamed('Dense-graded 12.5 mm');
    const n = await historyCount();
    const res = await admin.put(`${base}/mixes/${dense.id}`).send({ ...inputOf(dense), pricePerTon: -1 });
    expect(res.status).toBe(400);
    expect(issuePaths(res.body)).toEqual({ 'body.pricePerTon': 'must be more than $0' });
    const text = await admin.put(`${base}/mixes/${dense.id}`).send({ ...inputOf(dense), refLifeYears: 'ten' });
    expect(issuePaths(text.body)).toEqual({ 'body.refLifeYears': 'must be a number' });
    expect(await historyCount()).toBe(n);
    expect((await mixNamed('Dense-graded 12.5 mm')).pricePerTon).toBe(dense.pricePerTon);
  });

  it('an engineer cannot change a mix; an unknown mix is 404', async () => {
    const dense = await mixNamed('Dense-graded 12.5 mm');
    expect((await eng.put(`${base}/mixes/${dense.id}`).send(inputOf(dense))).status).toBe(403);
    expect((await admin.put(`${base}/mixes/no-such-mix`).send(inputOf(dense))).status).toBe(404);
  });

  it('adds a mix (history from nothing), and removes it while no treatment uses it', async () => {
    const add = await admin.post(`${base}/mixes`).send({
      name: 'Warm-mix 9.5 mm',
      binderGrade: 'PG 58-28',
      modifier: 'none',
      pricePerTon: 71,
      minLiftIn: 1,
      maxLiftIn: 2,
      refLiftIn: 1.5,
      refLifeYears: 10,
      priceEffectiveDate: '2027-05-01',
    });
    expect(add.status).toBe(201);
    const mix = MixSchema.parse(add.body);
    expect(mix).toMatchObject({ spreadRateLbPerSyIn: 110, coldWeatherNote: null, isDemo: false });
    const hist = PriceHistorySchema.parse((await admin.get(`${base}/price-history`)).body).items;
    expect(hist.filter((h) => h.entityId === mix.id).map((h) => [h.field, h.before, h.after])).toEqual([
      ['refLifeYears', null, 10],
      ['spreadRateLbPerSyIn', null, 110],
      ['pricePerTon', null, 71],
    ]);
    expect((await eng.delete(`${base}/mixes/${mix.id}`)).status).toBe(403);
    const del = await admin.delete(`${base}/mixes/${mix.id}`);
    expect(del.status).toBe(200);
    expect(del.body).toEqual({ ok: true });
    expect((await catalog()).mixes.some((m) => m.id === mix.id)).toBe(false);
    expect((await admin.delete(`${base}/mixes/${mix.id}`)).status).toBe(404);
  });
});

describe('treatments', () => {
  it('a cost-item change round-trips and is kept in the history as items', async () => {
    const chip = await treatmentNamed('Chip seal');
    const costItems = [{ label: 'Chip seal', basis: 'per_sy', amount: 3.35 }];
    const res = await admin
      .put(`${base}/treatments/${chip.id}`)
      .send({ ...inputOf(chip), costItems, priceEffectiveDate: '2027-03-15' });
    expect(res.status).toBe(200);
    expect(TreatmentSchema.parse(res.body)).toMatchObject({ costItems, effect: chip.effect, isDemo: false });
    expect((await treatmentNamed('Chip seal')).applicability).toEqual(chip.applicability);
    const [last] = PriceHistorySchema.parse((await admin.get(`${base}/price-history`)).body).items;
    expect(last).toMatchObject({
      entity: 'treatment',
      field: 'costItems',
      before: chip.costItems,
      after: costItems,
      effectiveDate: '2027-03-15',
    });
  });

  it('refuses a negative cost item naming it, and a mix of another agency', async () => {
    const chip = await treatmentNamed('Chip seal');
    const bad = await admin
      .put(`${base}/treatments/${chip.id}`)
      .send({ ...inputOf(chip), costItems: [{ label: 'Chip seal', basis: 'per_sy', amount: -2 }] });
    expect(bad.status).toBe(400);
    expect(issuePaths(bad.body)).toEqual({ 'body.costItems.0.amount': 'cannot be negative' });
    const marlowAdmin = await t.as('admin@marlow.example');
    const marlowMix = CatalogSchema.parse((await marlowAdmin.get(`/api/agencies/${t.ids.marlow}/catalog`)).body)
      .mixes[0];
    const thin = await treatmentNamed('Thin overlay');
    const foreignMix = await admin.put(`${base}/treatments/${thin.id}`).send({ ...inputOf(thin), mixId: marlowMix.id });
    expect(foreignMix.status).toBe(400);
    expect(issuePaths(foreignMix.body)).toEqual({ 'body.mixId': 'is not a mix of this agency' });
  });

  it('adds and removes a treatment; engineers may do neither', async () => {
    const crack = await treatmentNamed('Crack seal');
    const body = { ...inputOf(crack), name: 'Fog seal', kind: 'custom', priceEffectiveDate: '2027-06-01' };
    expect((await eng.post(`${base}/treatments`).send(body)).status).toBe(403);
    const add = await admin.post(`${base}/treatments`).send(body);
    expect(add.status).toBe(201);
    const fog = TreatmentSchema.parse(add.body);
    expect(fog).toMatchObject({ name: 'Fog seal', kind: 'custom', costItems: crack.costItems });
    expect((await eng.delete(`${base}/treatments/${fog.id}`)).status).toBe(403);
    expect((await admin.delete(`${base}/treatments/${fog.id}`)).body).toEqual({ ok: true });
    expect((await catalog()).treatments.some((x) => x.id === fog.id)).toBe(false);
  });
});

describe('economics', () => {
  it('saves and answers in the economics schema; refuses a rate of 120 % and a 0-year period by name; engineers cannot', async () => {
    const { economics } = await catalog();
    const next = { ...economics, discountRate: 0.031, discountRateSource: 'Agency policy, 2027' };
    const res = await admin.put(`${base}/economics`).send(next);
    expect(res.status).toBe(200);
    expect(EconomicsSchema.parse(res.body)).toEqual(next);
    const bad = await admin.put(`${base}/economics`).send({ ...next, discountRate: 1.2, analysisPeriodYears: 0 });
    expect(Object.keys(issuePaths(bad.body)).sort()).toEqual(['body.analysisPeriodYears', 'body.discountRate']);
    expect(issuePaths(bad.body)['body.analysisPeriodYears']).toBe('must be 1 to 100 years');
    expect((await eng.put(`${base}/economics`).send(next)).status).toBe(403);
    expect((await catalog()).economics).toEqual(next);
  });
});
