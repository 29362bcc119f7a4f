// Property of the plan (issue 9, quality bar): with an unlimited budget, every plan year's network PCI
// is at least that of the plan for any smaller budget. Run on the demo county (Brannock County, the
// real demo database through the test app) with the input snapshot a plan run freezes
// (server/plans/plan-input.ts): the whole county by the fast method, held to the property with no
// tolerance beyond floating point (1e-9 PCI); and 30 of its segments by the exact method (HiGHS, the
// `highs` package), whose optimum the property is about.
import loadHighs from 'highs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { planInput } from '../../server/plans/plan-input';
import { type PlanInput, runPlan } from '../../shared/engine/plan/run-plan';
import { createTestApp, type TestApp } from '../helpers/test-app';

let t: TestApp;
let input: PlanInput;
beforeAll(async () => {
  t = await createTestApp();
  const eng = await t.as('engineer@brannock.example');
  const res = await eng.post(`/api/agencies/${t.ids.brannock}/plans`).send({
    name: 'property',
    settings: { startYear: 2027, horizonYears: 5, budgetMode: 'flat', annualBudget: 1_000_000, method: 'fast' },
  });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  input = planInput(t.deps, t.ids.brannock, res.body.id);
});
afterAll(() => t.close());

const run = (budget: number) =>
  runPlan({ ...input, settings: { ...input.settings, budgets: new Array(5).fill(budget) } }, null);

describe('plan property: more money never leaves a year worse', () => {
  it('exact (HiGHS) on 30 demo segments: an unlimited budget leaves every year at least as good as $20k–$200k a year', async () => {
    const highs = await loadHighs();
    const small = { ...input, method: 'exact' as const, segments: input.segments.slice(0, 30), timeLimitSeconds: 20 };
    const runX = (budget: number) =>
      runPlan({ ...small, settings: { ...small.settings, budgets: new Array(5).fill(budget) } }, highs);
    const unlimited = runX(1e12);
    expect(unlimited.solution.status).toMatch(/^optimal/);
    for (const b of [20_000, 60_000, 200_000]) {
      const r = runX(b);
      expect(r.solution.status, `$${b}`).toMatch(/^optimal/);
      // The smaller budget binds: it buys less than the unlimited plan (else the check says nothing).
      const spent = r.years.reduce((x, y) => x + y.spent, 0);
      expect(spent, `$${b}`).toBeLessThan(unlimited.years.reduce((x, y) => x + y.spent, 0));
      for (let i = 0; i < r.years.length; i++)
        expect(unlimited.years[i].networkPci, `${r.years[i].calendarYear} at $${b}`).toBeGreaterThanOrEqual(
          r.years[i].networkPci - 1e-9,
        );
    }
  });

  it('with an unlimited budget every year is at least as good as with $0.5M, $1.5M, $3M or $6M a year', () => {
    const unlimited = run(1e12);
    for (const b of [500_000, 1_500_000, 3_000_000, 6_000_000]) {
      const r = run(b);
      const rows = r.years.map((y, i) => [y.calendarYear, unlimited.years[i].networkPci - y.networkPci]);
      console.log(`$${b / 1e6}M:`, rows.map(([c, d]) => `${c} ${d.toFixed(3)}`).join(', '));
      for (let i = 0; i < r.years.length; i++)
        expect(unlimited.years[i].networkPci, `${r.years[i].calendarYear} at $${b}`).toBeGreaterThanOrEqual(
          r.years[i].networkPci - 1e-9,
        );
    }
  });
});
