// HiGHS (the `highs` package, WebAssembly) as the independent optimum on small synthetic strategy
// instances (bench/synthetic-strategies.ts): the exact method's bound is HiGHS's own dual bound
// (info mip_dual_bound), never below its plan; the fast method's plan lies within its reported
// gap of HiGHS's, and HiGHS's bound is at least the fast plan (a maximum) whenever the fast plan
// meets every row. A property on a small instance closes: more money never lowers any year's
// condition when more money only buys more condition in every year.
import loadHighs from 'highs';
import { beforeAll, describe, expect, it } from 'vitest';
import { syntheticStrategies } from '../../bench/synthetic-strategies';
import { optionCount, type PackedInstance } from '../../shared/engine/plan/instance';
import { solvePlan } from '../../shared/engine/plan/solve';
import { rng } from '../../shared/engine/random';

let highs: Awaited<ReturnType<typeof loadHighs>>;
beforeAll(async () => {
  highs = await loadHighs();
});

describe('fast against HiGHS on small strategy instances', () => {
  it.each([
    { seed: 1, objective: 'benefit' as const, targets: [] as number[] },
    { seed: 2, objective: 'benefit' as const, targets: [3, 7] },
    { seed: 3, objective: 'benefit' as const, targets: [] },
    { seed: 4, objective: 'cost' as const, targets: [2, 5] },
    { seed: 5, objective: 'cost' as const, targets: [4] },
  ])(
    'seed $seed, objective $objective, targets in years $targets',
    { timeout: 60_000 },
    ({ seed, objective, targets }) => {
      const inst = syntheticStrategies({
        segments: 120,
        years: 8,
        perSegment: 8,
        budgetShare: objective === 'cost' ? 0.5 : 0.25,
        seed,
        objective,
        targetYears: targets,
        targetShare: 0.35,
      });
      const max = objective === 'benefit';
      const exact = solvePlan(inst, 'exact', highs, { timeLimitSeconds: 10, mipRelGap: 1e-6 });
      const fast = solvePlan(inst, 'fast', null);
      // HiGHS's dual bound bounds its own plan…
      if (max) expect(exact.bound).toBeGreaterThanOrEqual(exact.objective - 1e-6);
      else expect(exact.bound).toBeLessThanOrEqual(exact.objective + 1e-6);
      expect(exact.gap).toBeCloseTo(Math.abs(exact.bound - exact.objective) / Math.abs(exact.bound), 12);
      expect(exact.targetsMissed).toEqual([]);
      fast.spentByYear.forEach((s, y) => expect(s).toBeLessThanOrEqual(inst.budgets[y] * (1 + 1e-9) + 1e-6));
      // …and every plan that meets the rows; the fast plan is within its own reported gap of HiGHS.
      if (fast.targetsMissed.length === 0) {
        if (max) expect(exact.bound).toBeGreaterThanOrEqual(fast.objective - 1e-6);
        else expect(exact.bound).toBeLessThanOrEqual(fast.objective + 1e-6);
        expect(Math.abs(exact.objective - fast.objective)).toBeLessThanOrEqual(fast.gap * Math.abs(fast.bound) + 1e-6);
      }
      // The Lagrangian bound is a bound on HiGHS's plan too.
      if (max) expect(fast.bound).toBeGreaterThanOrEqual(exact.objective - 1e-6);
      else expect(fast.bound).toBeLessThanOrEqual(exact.objective + 1e-6);
      console.log(
        `seed ${seed} (${objective}): HiGHS ${exact.objective.toFixed(0)} (bound ${exact.bound.toFixed(0)}), fast ${fast.objective.toFixed(0)} (gap ${(fast.gap * 100).toFixed(3)} %), fast missed ${fast.targetsMissed.length}`,
      );
    },
  );
});

/**
 * Options per segment whose yearly condition gains grow with their cost in every year (a dearer
 * option buys at least as much condition in each year), costs spread over one to three years.
 */
function nestedInstance(seed: number, budget: number): PackedInstance & { gain: Float64Array } {
  const u = rng(seed);
  const Y = 5;
  const n = 30;
  const per = 4;
  const segStart = Int32Array.from({ length: n + 1 }, (_, i) => i * per);
  const N = n * per;
  const gain = new Float64Array(N * Y);
  const cost = new Float64Array(N * Y);
  const benefit = new Float64Array(N);
  for (let i = 0; i < n; i++) {
    const base = new Float64Array(Y);
    const spendYears = [Math.floor(u() * Y), Math.floor(u() * Y)];
    for (let j = 0; j < per; j++) {
      const o = i * per + j;
      for (let y = 0; y < Y; y++) {
        base[y] += 1 + u() * 5;
        gain[o * Y + y] = base[y];
        benefit[o] += base[y];
      }
      for (const y of spendYears) cost[o * Y + y] += (j + 1) * (5 + u() * 20);
    }
  }
  return {
    years: Y,
    budgets: new Float64Array(Y).fill(budget),
    nSegments: n,
    segStart,
    benefit,
    lcc: new Float64Array(N),
    cost,
    priority: new Float64Array(n),
    mustChoose: new Uint8Array(n),
    targets: [],
    objective: 'benefit',
    gain,
  };
}

describe('property: an unlimited budget never lowers a year’s objective contribution', () => {
  it.each([1, 2, 3, 4, 5, 6])('seed %i, exact and fast, budgets 40 … 400 a year against unlimited', (seed) => {
    const byYear = (inst: ReturnType<typeof nestedInstance>, pick: Int32Array) => {
      const out = new Float64Array(inst.years);
      for (let i = 0; i < inst.nSegments; i++)
        if (pick[i] >= 0) for (let y = 0; y < inst.years; y++) out[y] += inst.gain[pick[i] * inst.years + y];
      return out;
    };
    const unlimited = nestedInstance(seed, Number.POSITIVE_INFINITY);
    expect(optionCount(unlimited)).toBe(120);
    for (const method of ['exact', 'fast'] as const) {
      const top = byYear(unlimited, solvePlan(unlimited, method, highs).pick);
      for (const budget of [40, 120, 400]) {
        const inst = nestedInstance(seed, budget);
        const s = solvePlan(inst, method, highs);
        const yearly = byYear(inst, s.pick);
        yearly.forEach((v, y) =>
          expect(top[y], `${method}, budget ${budget}, year ${y + 1}`).toBeGreaterThanOrEqual(v - 1e-9),
        );
      }
    }
  });
});
