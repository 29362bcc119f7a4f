import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { syntheticOptimizeBody } from '../../bench/synthetic-network';
import { createTestApp, type TestApp } from '../helpers/test-app';

let t: TestApp;
let eng: Awaited<ReturnType<TestApp['as']>>;
let base: string;
beforeAll(async () => {
  t = await createTestApp();
  eng = await t.as('engineer@brannock.example');
  base = `/api/agencies/${t.ids.brannock}/plans`;
});
afterAll(() => t.close());

const settings = (over: Record<string, unknown> = {}) => ({
  startYear: 2027,
  horizonYears: 5,
  budgetMode: 'flat',
  annualBudget: 2_400_000,
  method: 'fast',
  ...over,
});

async function runToEnd(planId: string) {
  const start = await eng.post(`${base}/${planId}/run`);
  expect(start.status).toBe(202);
  for (let i = 0; i < 300; i++) {
    const r = await eng.get(`/api/agencies/${t.ids.brannock}/runs/${start.body.id}`);
    if (r.body.status !== 'running') return r.body;
    await new Promise((res) => setTimeout(res, 100));
  }
  throw new Error('plan run did not finish');
}

describe('plans', () => {
  let planId: string;
  it('creates a scenario, runs it in a worker and reports per year', async () => {
    const created = await eng.post(base).send({ name: '$2.4M a year', settings: settings() });
    expect(created.status).toBe(201);
    planId = created.body.id;
    const run = await runToEnd(planId);
    expect(run.status).toBe('done');
    const r = run.result;
    expect(r.years).toHaveLength(5);
    for (const y of r.years) {
      expect(y.spent).toBeLessThanOrEqual(y.budget + 1e-6);
      expect(y.networkPci).toBeGreaterThanOrEqual(0);
      expect(y.networkPci).toBeLessThanOrEqual(100);
    }
    // Work done keeps the network better than doing nothing.
    expect(r.summary.finalPci).toBeGreaterThan(r.summary.finalPciDoNothing);
    expect(r.work.length).toBeGreaterThan(10);
    expect(r.work[0]).toEqual(
      expect.objectContaining({
        segmentId: expect.any(String),
        treatment: expect.any(String),
        cost: expect.any(Number),
        areaSy: expect.any(Number),
      }),
    );
    // The optimiser beats the worst-first baseline on its own objective.
    expect(r.solution.totalBenefit).toBeGreaterThanOrEqual(r.baseline.totalBenefit);
    expect(r.solution.gap).toBeLessThan(0.02);
  });

  it('exports the work list and a brief PDF with pages and headings', async () => {
    const csv = await eng.get(`${base}/${planId}/work-list?format=csv`);
    expect(csv.status).toBe(200);
    expect(csv.text.split(/\r?\n/)[0]).toBe(
      'Year,Segment ID,Road name,From,To,Treatment,Mix,Thickness (in),Tons,Area (SY),Lane-miles,Cost ($),PCI before,PCI after,Strategy,Structural caution',
    );
    const pdf = await eng
      .get(`${base}/${planId}/brief.pdf`)
      .buffer(true)
      .parse((res, cb) => {
        const chunks: Buffer[] = [];
        res.on('data', (c: Buffer) => chunks.push(c));
        res.on('end', () => cb(null, Buffer.concat(chunks)));
      });
    expect(pdf.status).toBe(200);
    const text = (pdf.body as Buffer).toString('latin1');
    expect(text.startsWith('%PDF-')).toBe(true);
    expect((text.match(/\/Type \/Page\b/g) ?? []).length).toBeGreaterThanOrEqual(2);
    for (const h of [
      'Summary',
      'The plan in four numbers',
      'Budget choices side by side',
      'Network condition',
      'Backlog',
      'Map of the planned work',
      'Work list, first two years',
      'Cautions',
    ])
      expect(text).toContain(`(${h})`);
  });

  it('viewers see only published plans; publishing e-mails them a link', async () => {
    const viewer = await t.as('viewer@brannock.example');
    expect((await viewer.get(`${base}/${planId}`)).status).toBe(404);
    expect((await viewer.get(base)).body.items).toHaveLength(0);
    const pub = await eng.post(`${base}/${planId}/publish`).send({ publish: true, notifyViewers: true });
    expect(pub.status).toBe(200);
    expect(pub.body.notified).toBe(1);
    expect(t.lastMailTo('viewer@brannock.example')?.textBody).toContain(`/plans/${planId}`);
    expect((await viewer.get(`${base}/${planId}/result`)).body.latest.result.years).toHaveLength(5);
    expect((await viewer.post(`${base}/${planId}/run`)).status).toBe(403);
  });

  it('bad settings answer 400 naming the field', async () => {
    const cases: [Record<string, unknown>, string][] = [
      [settings({ annualBudget: -5 }), 'body.settings.annualBudget'],
      [settings({ annualBudget: undefined }), 'body.settings.annualBudget'],
      [settings({ horizonYears: 0 }), 'body.settings.horizonYears'],
      [settings({ horizonYears: 21 }), 'body.settings.horizonYears'],
      [settings({ budgetMode: 'custom', budgets: [1, 2] }), 'body.settings.budgets'],
    ];
    for (const [s, path] of cases) {
      const res = await eng.post(base).send({ name: 'bad', settings: s });
      expect(res.status, path).toBe(400);
      expect(res.body.error.issues.map((i: { path: string }) => i.path)).toContain(path);
    }
  });

  it('a plan with no applicable treatment, and a run on an empty inventory, say so', async () => {
    // A treatment that applies only to interstates: the demo county has none.
    const admin = await t.as('admin@brannock.example');
    const only = await admin.post(`/api/agencies/${t.ids.brannock}/catalog/treatments`).send({
      name: 'Interstate diamond grind',
      category: 'rehabilitation',
      kind: 'custom',
      lifeYears: 10,
      productionSyPerDay: 5000,
      costItems: [{ label: 'Grinding', basis: 'per_sy', amount: 6 }],
      effect: { type: 'reset', value: 95, resetsAge: true },
      applicability: { pciMin: 0, pciMax: 100, surfaces: ['concrete'], classes: ['interstate'], minYearsSinceLast: 0 },
      priceEffectiveDate: '2026-12-01',
    });
    expect(only.status).toBe(201);
    const p = await eng
      .post(base)
      .send({ name: 'nothing applies', settings: settings({ treatmentIds: [only.body.id] }) });
    const res = await eng.post(`${base}/${p.body.id}/run`);
    expect(res.status).toBe(400);
    expect(res.body.error.issues[0].path).toBe('settings.treatmentIds');
    const empty = await createTestApp({}, { seed: false });
    try {
      const { db } = empty;
      const { seedDemo } = await import('../../server/seed/seed');
      const ids = await seedDemo(db);
      empty.sqlite.prepare('DELETE FROM segments WHERE agency_id = ?').run(ids.marlow);
      const m = await empty.as('engineer@marlow.example');
      const plan = await m.post(`/api/agencies/${ids.marlow}/plans`).send({ name: 'x', settings: settings() });
      const run = await m.post(`/api/agencies/${ids.marlow}/plans/${plan.body.id}/run`);
      expect(run.status).toBe(409);
      expect(run.body.error.message).toMatch(/inventory is empty/);
    } finally {
      await empty.close();
    }
  });

  it('other agencies cannot reach the plan', async () => {
    const marlow = await t.as('engineer@marlow.example');
    expect((await marlow.get(`${base}/${planId}`)).status).toBe(404);
    expect((await marlow.get(`/api/agencies/${t.ids.marlow}/plans/${planId}`)).status).toBe(404);
  });
});

describe('POST /api/plan/optimize', () => {
  it('answers the documented example', async () => {
    const res = await eng.post('/api/plan/optimize').send({
      budgets: [90, 90],
      method: 'exact',
      segments: [
        {
          id: 'A',
          options: [
            { id: 'A-crack', year: 0, cost: 10, benefit: 40 },
            { id: 'A-overlay', year: 1, cost: 60, benefit: 120 },
          ],
        },
      ],
    });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({
      method: 'exact',
      chosen: [{ segmentId: 'A', optionId: 'A-overlay' }],
      totalBenefit: 120,
      spentByYear: [0, 60],
      bound: 120,
      gap: 0,
    });
  });

  it('takes treatment paths with costs in several years, and every method', async () => {
    for (const method of ['exact', 'fast', 'ranking']) {
      const res = await eng.post('/api/plan/optimize').send({
        budgets: [60, 60],
        method,
        segments: [
          {
            id: 'P',
            options: [
              {
                id: 'P-path',
                benefit: 100,
                costs: [
                  { year: 0, cost: 50 },
                  { year: 1, cost: 50 },
                ],
              },
            ],
          },
          { id: 'Q', options: [{ id: 'Q1', year: 1, cost: 60, benefit: 70 }] },
        ],
      });
      expect(res.status, method).toBe(200);
      expect(res.body.spentByYear[1]).toBeLessThanOrEqual(60);
    }
  });

  it('refuses negative or missing budgets and options outside the years, naming the field', async () => {
    const neg = await eng.post('/api/plan/optimize').send({ budgets: [-1], segments: [] });
    expect(neg.status).toBe(400);
    expect(neg.body.error.issues[0].path).toBe('body.budgets.0');
    const none = await eng.post('/api/plan/optimize').send({ segments: [] });
    expect(none.body.error.issues[0].path).toBe('body.budgets');
    const late = await eng
      .post('/api/plan/optimize')
      .send({ budgets: [10], segments: [{ id: 'A', options: [{ id: 'a', year: 3, cost: 1, benefit: 1 }] }] });
    expect(late.status).toBe(400);
    expect(late.body.error.issues[0].path).toBe('body.segments.0.options.0');
  });

  it('adds up costs listed twice for one year, in every method (issue 13: spent 12 of a budget of 10 before)', async () => {
    // Worked by hand: A's only option costs 6 + 6 = 12 in year 0 against a budget of 10, so it never fits;
    // B (cost 8, benefit 5) does. Every method must choose B alone, spend 8 and report benefit 5.
    for (const method of ['exact', 'fast', 'ranking']) {
      const res = await eng.post('/api/plan/optimize').send({
        budgets: [10],
        method,
        segments: [
          {
            id: 'A',
            priority: 0,
            options: [
              {
                id: 'A-twice',
                benefit: 50,
                costs: [
                  { year: 0, cost: 6 },
                  { year: 0, cost: 6 },
                ],
              },
            ],
          },
          { id: 'B', priority: 1, options: [{ id: 'B1', year: 0, cost: 8, benefit: 5 }] },
        ],
      });
      expect(res.status, method).toBe(200);
      expect(res.body.chosen, method).toEqual([{ segmentId: 'B', optionId: 'B1' }]);
      expect(res.body.spentByYear, method).toEqual([8]);
      expect(res.body.totalBenefit, method).toBe(5);
    }
  });

  it('refuses duplicate segment ids with 400 naming the field', async () => {
    const res = await eng.post('/api/plan/optimize').send({
      budgets: [10],
      segments: [
        { id: 'A', options: [{ id: 'a', year: 0, cost: 1, benefit: 1 }] },
        { id: 'B', options: [] },
        { id: 'A', options: [{ id: 'a', year: 0, cost: 2, benefit: 3 }] },
      ],
    });
    expect(res.status).toBe(400);
    expect(res.body.error.issues[0].path).toBe('body.segments.2.id');
    expect(res.body.error.issues[0].message).toMatch(/repeats the id of segment 0/);
    const opt = await eng.post('/api/plan/optimize').send({
      budgets: [10],
      segments: [
        {
          id: 'A',
          options: [
            { id: 'a', year: 0, cost: 1, benefit: 1 },
            { id: 'a', year: 0, cost: 2, benefit: 3 },
          ],
        },
      ],
    });
    expect(opt.status).toBe(400);
    expect(opt.body.error.issues[0].path).toBe('body.segments.0.options.1.id');
  });

  it('the exact method takes at most 20,000 options (checked in the worker, naming the field)', async () => {
    const over = syntheticOptimizeBody(2001, 10, 10, 1);
    const res = await eng.post('/api/plan/optimize').send(over);
    expect(res.status).toBe(400);
    expect(res.body.error.issues).toEqual([{ path: 'body.method', message: 'too many options for exact' }]);
    expect(res.body.error.message).toMatch(/at most 20,000 options/);
    const bad = await eng.post('/api/plan/optimize').set('Content-Type', 'application/json').send('{"budgets": [1,');
    expect(bad.status).toBe(400);
    expect(bad.body.error.message).toBe('The request body is not valid JSON');
  });
});
