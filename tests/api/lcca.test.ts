import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../helpers/test-app';

let t: TestApp;
let eng: Awaited<ReturnType<TestApp['as']>>;
let catalog: { mixes: { id: string; name: string }[]; treatments: { id: string; name: string; kind: string }[] };
beforeAll(async () => {
  t = await createTestApp();
  eng = await t.as('engineer@brannock.example');
  catalog = (await eng.get(`/api/agencies/${t.ids.brannock}/catalog`)).body;
});
afterAll(() => t.close());

const minimal = {
  discountRate: 0.04,
  analysisPeriodYears: 35,
  alternatives: [
    {
      name: 'A',
      activities: [
        { year: 0, cost: 1_000_000, serviceLifeYears: 20 },
        { year: 20, cost: 500_000, serviceLifeYears: 20 },
      ],
    },
    {
      name: 'B',
      activities: [
        { year: 0, cost: 1_000_000, serviceLifeYears: 15 },
        { year: 15, cost: 400_000, serviceLifeYears: 12 },
      ],
    },
  ],
};

describe('POST /api/lcca/evaluate', () => {
  it('answers the minimal form with the FHWA quantities (hand-worked in tests/engine/lcca.test.ts)', async () => {
    const res = await eng.post('/api/lcca/evaluate').send(minimal);
    expect(res.status).toBe(200);
    const [a, b] = res.body.alternatives;
    expect(a.name).toBe('A');
    expect(a.presentValue).toBeCloseTo(1_196_516.54, 1);
    expect(a.euac).toBeCloseTo(64_106.15, 1);
    expect(a.remainingServiceLifeValue).toBeCloseTo(125_000, 6);
    expect(a.presentValueOfRemainingLife).toBeCloseTo(31_676.93, 1);
    expect(a.cashFlows).toEqual([
      expect.objectContaining({ year: 0, cost: 1_000_000, presentValue: 1_000_000 }),
      expect.objectContaining({ year: 20, cost: 500_000 }),
    ]);
    expect(b.presentValue).toBeCloseTo(1_222_105.8, 1);
  });

  it('accepts a plan priced per unit with group quantities', async () => {
    const res = await eng.post('/api/lcca/evaluate').send({
      discountRate: 0,
      analysisPeriodYears: 10,
      quantities: { areaSy: 7040, laneMiles: 1 },
      alternatives: [
        {
          name: 'seal',
          plan: { initial: { label: 'chip seal', serviceLifeYears: 5, rates: { perSy: 3 } }, repeatAtEndOfLife: true },
        },
      ],
    });
    expect(res.status).toBe(200);
    // Two chip seals at 3 $/SY on 7,040 SY at a zero rate, no remaining life: 2 × 21,120.
    expect(res.body.alternatives[0].presentValue).toBeCloseTo(42_240, 6);
  });

  const bad: [string, unknown, string][] = [
    [
      'negative life',
      { ...minimal, alternatives: [{ name: 'A', activities: [{ year: 0, cost: 1, serviceLifeYears: -3 }] }] },
      'body.alternatives.0.activities.0.serviceLifeYears',
    ],
    ['rate of −100 %', { ...minimal, discountRate: -1 }, 'body.discountRate'],
    ['period 0', { ...minimal, analysisPeriodYears: 0 }, 'body.analysisPeriodYears'],
    [
      'an alternative with no activity',
      { ...minimal, alternatives: [{ name: 'A', activities: [] }] },
      'body.alternatives.0.activities',
    ],
    [
      'an activity after the period',
      { ...minimal, alternatives: [{ name: 'A', activities: [{ year: 40, cost: 1, serviceLifeYears: 5 }] }] },
      'body.alternatives.0.activities.0.year',
    ],
    ['a string for a number', { ...minimal, discountRate: '4%' }, 'body.discountRate'],
  ];
  it.each(bad)('%s → 400 naming the field', async (_name, body, path) => {
    const res = await eng.post('/api/lcca/evaluate').send(body as object);
    expect(res.status).toBe(400);
    expect(res.body.error.issues.map((i: { path: string }) => i.path)).toContain(path);
  });

  it('needs a signed-in user', async () => {
    expect((await t.anonymous().post('/api/lcca/evaluate').send(minimal)).status).toBe(401);
  });
});

describe('catalog', () => {
  it('holds the demo mixes and treatments, labelled as demo values', async () => {
    const viewer = await t.as('viewer@brannock.example');
    const res = await viewer.get(`/api/agencies/${t.ids.brannock}/catalog`);
    expect(res.status).toBe(200);
    expect(res.body.demoValues).toBe(true);
    expect(res.body.mixes.map((m: { name: string }) => m.name)).toContain('Rubber-modified, dry process');
    expect(res.body.treatments).toHaveLength(7);
    expect(res.body.economics).toMatchObject({ discountRate: 0.02, analysisPeriodYears: 40, mobilizationPerJob: 3500 });
  });

  it('admins change a price with its effective date; the change is in the price history; engineers cannot edit', async () => {
    const admin = await t.as('admin@brannock.example');
    const full = (await admin.get(`/api/agencies/${t.ids.brannock}/catalog`)).body.mixes.find(
      (m: { name: string }) => m.name === 'Dense-graded 12.5 mm',
    );
    const { id, isDemo: _d, ...input } = full;
    const res = await admin
      .put(`/api/agencies/${t.ids.brannock}/catalog/mixes/${id}`)
      .send({ ...input, pricePerTon: 76.5, priceEffectiveDate: '2026-11-15' });
    expect(res.status).toBe(200);
    expect(res.body.pricePerTon).toBe(76.5);
    const hist = await admin.get(`/api/agencies/${t.ids.brannock}/catalog/price-history`);
    expect(hist.body.items[0]).toMatchObject({
      entity: 'mix',
      field: 'pricePerTon',
      before: 74,
      after: 76.5,
      effectiveDate: '2026-11-15',
    });
    const denied = await eng
      .put(`/api/agencies/${t.ids.brannock}/catalog/mixes/${id}`)
      .send({ ...input, pricePerTon: 1 });
    expect(denied.status).toBe(403);
  });

  it('refuses a mix whose lift range is reversed, naming the field', async () => {
    const admin = await t.as('admin@brannock.example');
    const res = await admin.post(`/api/agencies/${t.ids.brannock}/catalog/mixes`).send({
      name: 'X',
      binderGrade: 'PG 58-28',
      modifier: 'none',
      pricePerTon: 70,
      minLiftIn: 3,
      maxLiftIn: 2,
      refLiftIn: 2.5,
      refLifeYears: 10,
      priceEffectiveDate: '2026-12-01',
    });
    expect(res.status).toBe(400);
    expect(res.body.error.issues.map((i: { path: string }) => i.path)).toContain('body.minLiftIn');
  });

  it('will not delete a mix a treatment uses', async () => {
    const admin = await t.as('admin@brannock.example');
    const thin = catalog.mixes.find((m) => m.name === 'Thin-lift 9.5 mm')!;
    const res = await admin.delete(`/api/agencies/${t.ids.brannock}/catalog/mixes/${thin.id}`);
    expect(res.status).toBe(409);
    expect(res.body.error.message).toMatch(/Thin overlay/);
  });
});

async function poll(url: string) {
  for (let i = 0; i < 200; i++) {
    const r = await eng.get(url);
    if (r.body.status !== 'running') return r;
    await new Promise((res) => setTimeout(res, 100));
  }
  throw new Error('run did not finish');
}

describe('catalog-based comparisons', () => {
  const byName = (n: string) => catalog.treatments.find((x) => x.name === n)!.id;
  const mix = (n: string) => catalog.mixes.find((x) => x.name === n)!.id;
  let segIds: number[];
  beforeAll(async () => {
    const list = await eng.get(`/api/agencies/${t.ids.brannock}/segments?class=minor_arterial&limit=12`);
    segIds = list.body.items.map((s: { id: number }) => s.id);
  });
  const request = () => ({
    name: 'Parkway resurfacing',
    group: { label: 'Parkway', segmentIds: segIds, areaSy: 1, laneMiles: 1, centrelineMiles: 1, segments: [] },
    alternatives: [
      {
        name: '2 in dense-graded',
        initial: { treatmentId: byName('Mill and overlay (2 in)') },
        rehabilitation: [],
        maintenance: [{ treatmentId: byName('Crack seal'), everyYears: 4 }],
      },
      {
        name: '1.5 in rubber-modified',
        initial: {
          treatmentId: byName('Mill and overlay (2 in)'),
          mixId: mix('Rubber-modified, dry process'),
          thicknessIn: 1.5,
        },
        maintenance: [{ treatmentId: byName('Crack seal'), everyYears: 4 }],
      },
      { name: 'Chip seal cycle', initial: { treatmentId: byName('Chip seal') } },
    ],
    risk: { iterations: 1000, seed: 99 },
  });

  it('runs off the request thread, reports, saves with its snapshot and re-runs to the same answer', async () => {
    const start = await eng.post(`/api/agencies/${t.ids.brannock}/analyses/runs`).send(request());
    expect(start.status).toBe(202);
    expect(start.body.status).toBe('running');
    const done = await poll(`/api/agencies/${t.ids.brannock}/runs/${start.body.id}`);
    expect(done.body.status).toBe('done');
    const r = done.body.result;
    expect(r.alternatives).toHaveLength(3);
    // Quantities come from the agency's own segments, not from the request.
    expect(r.group.segments).toBe(12);
    expect(r.group.laneMiles).toBeGreaterThan(10);
    expect(r.monteCarlo.iterations).toBe(1000);
    expect(r.monteCarlo.probabilityCheapest.reduce((s: number, p: number) => s + p, 0)).toBeCloseTo(1, 9);
    expect(r.sensitivity.rows.length).toBeGreaterThan(3);
    expect(r.cautions.some((c: { kind: string }) => c.kind === 'cold-weather')).toBe(true);
    // The 1.5-in lift needs fewer tons: 0.5 in × 108 vs 110 lb/SY-in over the same area.
    expect(r.alternatives[1].initialTons).toBeLessThan(r.alternatives[0].initialTons);

    const saved = await eng
      .post(`/api/agencies/${t.ids.brannock}/analyses`)
      .send({ name: 'Parkway resurfacing', runId: start.body.id });
    expect(saved.status).toBe(201);
    const list = await eng.get(`/api/agencies/${t.ids.brannock}/analyses`);
    expect(list.body.items[0]).toMatchObject({ name: 'Parkway resurfacing', alternatives: 3 });

    // A later price change does not touch the saved comparison's own prices.
    const admin = await t.as('admin@brannock.example');
    const full = (await admin.get(`/api/agencies/${t.ids.brannock}/catalog`)).body.mixes.find(
      (m: { name: string }) => m.name === 'Rubber-modified, dry process',
    );
    const { id, isDemo: _d, ...input } = full;
    await admin.put(`/api/agencies/${t.ids.brannock}/catalog/mixes/${id}`).send({ ...input, pricePerTon: 120 });
    const rerun = await eng.post(`/api/agencies/${t.ids.brannock}/analyses/${saved.body.id}/rerun`);
    expect(rerun.status).toBe(202);
    const again = await poll(`/api/agencies/${t.ids.brannock}/runs/${rerun.body.id}`);
    expect(again.body.result).toEqual(r);

    const csv = await eng.get(`/api/agencies/${t.ids.brannock}/analyses/${saved.body.id}/export?format=csv`);
    expect(csv.status).toBe(200);
    expect(csv.text.split('\n')[0]).toMatch(/^Alternative,Rank,Present value \(\$\),EUAC \(\$ per year\)/);
    expect(csv.text).toContain('1.5 in rubber-modified');
  });

  it('a lift outside the mix’s range answers 400 naming the field, before any run starts', async () => {
    const req = request();
    req.alternatives[1].initial.thicknessIn = 2.5;
    const res = await eng.post(`/api/agencies/${t.ids.brannock}/analyses/runs`).send(req);
    expect(res.status).toBe(400);
    expect(res.body.error.issues[0].path).toBe('alternatives.1.initial.thicknessIn');
    expect(res.body.error.message).toMatch(/1–2 in/);
  });

  it('a risk range that leaves out the base value answers 400 naming the field (low 80 / high 120 around a price of $76.50)', async () => {
    const req = {
      ...request(),
      risk: { iterations: 500, seed: 1, ranges: { [`mix:${mix('Dense-graded 12.5 mm')}`]: { low: 80, high: 120 } } },
    };
    const res = await eng.post(`/api/agencies/${t.ids.brannock}/analyses/runs`).send(req);
    expect(res.status).toBe(400);
    expect(res.body.error.issues[0].path).toBe(`risk.ranges.mix:${mix('Dense-graded 12.5 mm')}.low`);
    expect(res.body.error.message).toMatch(
      /low 80 is above the value the comparison uses, 76.5, for Dense-graded 12.5 mm price/,
    );
    const reversed = { ...req, risk: { ...req.risk, ranges: { rate: { low: 0.05, high: 0.01 } } } };
    const res2 = await eng.post(`/api/agencies/${t.ids.brannock}/analyses/runs`).send(reversed);
    expect(res2.status).toBe(400);
    expect(res2.body.error.issues.map((i: { path: string }) => i.path)).toContain('body.risk.ranges.rate.low');
  });

  it('one alternative is not a comparison', async () => {
    const req = request();
    req.alternatives = req.alternatives.slice(0, 1);
    const res = await eng.post(`/api/agencies/${t.ids.brannock}/analyses/runs`).send(req);
    expect(res.status).toBe(400);
    expect(res.body.error.issues[0].path).toBe('body.alternatives');
  });

  it('segments of another agency are refused, and a run can be cancelled', async () => {
    const marlowSeg = (
      await (await t.as('engineer@marlow.example')).get(`/api/agencies/${t.ids.marlow}/segments?limit=1`)
    ).body.items[0].id;
    const req = request();
    req.group.segmentIds = [marlowSeg];
    const res = await eng.post(`/api/agencies/${t.ids.brannock}/analyses/runs`).send(req);
    expect(res.status).toBe(400);
    expect(res.body.error.issues[0].path).toBe('group.segmentIds');

    const big = { ...request(), risk: { iterations: 20_000, seed: 1 } };
    const start = await eng.post(`/api/agencies/${t.ids.brannock}/analyses/runs`).send(big);
    const cancelled = await eng.post(`/api/agencies/${t.ids.brannock}/runs/${start.body.id}/cancel`);
    expect(['cancelled', 'done']).toContain(cancelled.body.status);
  });

  it('viewers cannot run comparisons and other agencies cannot see them', async () => {
    const viewer = await t.as('viewer@brannock.example');
    expect((await viewer.post(`/api/agencies/${t.ids.brannock}/analyses/runs`).send(request())).status).toBe(403);
    const marlow = await t.as('engineer@marlow.example');
    expect((await marlow.get(`/api/agencies/${t.ids.brannock}/analyses`)).status).toBe(404);
  });
});
