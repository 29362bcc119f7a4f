// findBudget (shared/engine/plan/budget-search.ts) on step functions whose thresholds are known
// by construction: the answer must meet the rule and lie within $1,000 or 0.1 % (whichever is
// larger) above the threshold, and 'hold-every-year' must test every year, not only the last.
import { describe, expect, it } from 'vitest';
import { findBudget } from '../../shared/engine/plan/budget-search';

const step = (threshold: number) => (b: number) => (b >= threshold ? 72 : 64);

describe('findBudget', () => {
  it.each([
    [1_234_567, 50_000_000],
    [730, 10_000_000],
    [48_000_001, 50_000_000],
  ])('finds the threshold %i of a monotone step to $1,000 or 0.1 % (max %i)', (threshold, maxBudget) => {
    const f = step(threshold);
    let calls = 0;
    const r = findBudget(
      (b) => {
        calls++;
        return { pciByYear: [70, f(b), f(b)] };
      },
      { targetPci: 70, rule: 'final-year', maxBudget },
    );
    expect(r.reachable).toBe(true);
    expect(r.budget!).toBeGreaterThanOrEqual(threshold);
    expect(r.budget! - threshold).toBeLessThanOrEqual(Math.max(1000, 0.001 * r.budget!));
    // The answer was evaluated and met the rule; every evaluation is a point, in order of budget.
    expect(r.points.some((p) => p.budget === r.budget && p.finalPci >= 70)).toBe(true);
    expect(r.points.length).toBe(calls);
    expect(r.points.map((p) => p.budget)).toEqual([...r.points.map((p) => p.budget)].sort((a, b) => a - b));
    expect(r.tolerance).toMatch(/\$1,000 or 0\.1 %/);
  });

  it('"hold every year" tests every year: a dip in year 2 needs more money than the last year does', () => {
    // Year 2 holds PCI 70 from $3,000,000 a year; the last year from $1,000,000.
    const evaluate = (b: number) => ({ pciByYear: [71, b >= 3_000_000 ? 70.5 : 66, b >= 1_000_000 ? 70 : 65] });
    const hold = findBudget(evaluate, { targetPci: 70, rule: 'hold-every-year', maxBudget: 20_000_000 });
    const last = findBudget(evaluate, { targetPci: 70, rule: 'final-year', maxBudget: 20_000_000 });
    expect(hold.budget!).toBeGreaterThanOrEqual(3_000_000);
    expect(hold.budget! - 3_000_000).toBeLessThanOrEqual(3_000);
    expect(last.budget!).toBeGreaterThanOrEqual(1_000_000);
    expect(last.budget! - 1_000_000).toBeLessThanOrEqual(1_000);
    expect(hold.points.find((p) => p.budget === hold.budget)!.minPci).toBeGreaterThanOrEqual(70);
  });

  it('says plainly when even the most money does not reach the target, and when none is needed', () => {
    const never = findBudget(() => ({ pciByYear: [60, 61] }), { targetPci: 70, rule: 'final-year', maxBudget: 5e6 });
    expect(never).toMatchObject({ budget: null, reachable: false });
    expect(never.tolerance).toMatch(/not reachable/);
    const free = findBudget(() => ({ pciByYear: [80, 79] }), {
      targetPci: 70,
      rule: 'hold-every-year',
      maxBudget: 5e6,
    });
    expect(free).toMatchObject({ budget: 0, reachable: true });
  });

  it('reports progress up to 1', () => {
    const seen: number[] = [];
    findBudget((b) => ({ pciByYear: [step(2_500_000)(b)] }), {
      targetPci: 70,
      rule: 'final-year',
      maxBudget: 9e6,
      onProgress: (f) => seen.push(f),
    });
    expect(seen.at(-1)).toBe(1);
    expect(seen.every((f, i) => i === 0 || f >= seen[i - 1])).toBe(true);
  });
});
