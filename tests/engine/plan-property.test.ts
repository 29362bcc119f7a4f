// Property of the plan (issue 9, quality bar): with an unlimited budget, every plan year's network PCI
// is at least that of the plan for any smaller budget. Run on the demo county (Brannock County, the
// real demo database through the test app) with the input snapshot a plan run freezes
// (server/plans/plan-input.ts), by the fast method.
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
