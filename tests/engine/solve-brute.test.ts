// The packed solvers against enumeration (every combination tried by plain summation:
// shared/engine/plan/brute-force.ts) on tiny synthetic strategy instances, with targets,
// segments that must take work, and both objectives. HiGHS must find the enumerated optimum;
// the fast method's bound must lie on the right side of it and its plan within its own gap.
import loadHighs from 'highs';
import { beforeAll, describe, expect, it } from 'vitest';
import { syntheticStrategies } from '../../bench/synthetic-strategies';
import { solveBruteForce } from '../../shared/engine/plan/brute-force';
import type { PackedInstance } from '../../shared/engine/plan/instance';
import { solvePlan } from '../../shared/engine/plan/solve';

let highs: Awaited<ReturnType<typeof loadHighs>>;
beforeAll(async () => {
  highs = await loadHighs();
});

const cases: { name: string; make: (seed: number) => PackedInstance }[] = [
  {
    name: 'benefit, budgets only',
    make: (seed) => syntheticStrategies({ segments: 5, years: 4, perSegment: 3, budgetShare: 0.35, seed }),
  },
  {
    name: 'benefit, a condition target in year 3 and segments that must take work',
    make: (seed) =>
      syntheticStrategies({
        segments: 5,
        years: 4,
        perSegment: 3,
        budgetShare: 0.5,
        seed,
        targetYears: [2],
        targetShare: 0.4,
        mustShare: 0.3,
      }),
  },
  {
    name: 'least life-cycle cost subject to condition targets in years 2 and 4',
    make: (seed) =>
      syntheticStrategies({
        segments: 5,
        years: 4,
        perSegment: 3,
        budgetShare: 0.6,
        seed,
        objective: 'cost',
        targetYears: [1, 3],
        targetShare: 0.35,
      }),
  },
  {
    name: 'least life-cycle cost, segments that must take work',
    make: (seed) =>
      syntheticStrategies({
        segments: 5,
        years: 4,
        perSegment: 3,
        budgetShare: 0.6,
        seed,
        objective: 'cost',
        mustShare: 0.5,
      }),
  },
];

describe.each(cases)('against enumeration: $name', ({ make }) => {
  it.each(Array.from({ length: 10 }, (_, s) => s + 1))('seed %i', (seed) => {
    const inst = make(seed);
    const max = inst.objective === 'benefit';
    const best = solveBruteForce(inst);
    if (best === null) {
      // No combination meets every row: HiGHS says so rather than returning a plan.
      expect(() => solvePlan(inst, 'exact', highs)).toThrow(/no choice of work|cannot be met|must take work/);
      const fast = solvePlan(inst, 'fast', null);
      expect(fast.targetsMissed.length > 0 || fast.status.startsWith('no choice')).toBe(true);
      return;
    }
    const exact = solvePlan(inst, 'exact', highs);
    expect(exact.objective).toBeCloseTo(best.objective, 6);
    expect(exact.targetsMissed).toEqual([]);
    // HiGHS's own dual bound is on the right side of the optimum.
    if (max) expect(exact.bound).toBeGreaterThanOrEqual(best.objective - 1e-6);
    else expect(exact.bound).toBeLessThanOrEqual(best.objective + 1e-6);
    const fast = solvePlan(inst, 'fast', null);
    // The Lagrangian bound is a bound on the optimum, whatever the fast plan.
    if (max) expect(fast.bound).toBeGreaterThanOrEqual(best.objective - 1e-6);
    else expect(fast.bound).toBeLessThanOrEqual(best.objective + 1e-6);
    fast.spentByYear.forEach((s, y) => expect(s).toBeLessThanOrEqual(inst.budgets[y] * (1 + 1e-9) + 1e-6));
    if (fast.targetsMissed.length === 0) {
      // A plan meeting every row is no better than the optimum, and within its reported gap of it.
      if (max) expect(fast.objective).toBeLessThanOrEqual(best.objective + 1e-6);
      else expect(fast.objective).toBeGreaterThanOrEqual(best.objective - 1e-6);
      expect(Math.abs(best.objective - fast.objective)).toBeLessThanOrEqual(fast.gap * Math.abs(fast.bound) + 1e-6);
    }
    const rank = solvePlan(inst, 'ranking', null);
    rank.spentByYear.forEach((s, y) => expect(s).toBeLessThanOrEqual(inst.budgets[y] * (1 + 1e-9) + 1e-6));
  });
});

describe('hand-worked cases', () => {
  const base = (over: Partial<PackedInstance>): PackedInstance => ({
    years: 2,
    budgets: Float64Array.from([100, 100]),
    nSegments: 2,
    segStart: Int32Array.from([0, 1, 2]),
    benefit: Float64Array.from([90, 60]),
    lcc: Float64Array.from([50, 20]),
    cost: Float64Array.from([100, 0, 100, 0]),
    priority: Float64Array.from([0, 1]),
    mustChoose: new Uint8Array(2),
    targets: [],
    objective: 'benefit',
    ...over,
  });
  it('a segment that must take work gets it even when another is worth more (worked by hand)', () => {
    // Year-0 money 100 buys A (benefit 90) or B (60), not both. B must take work: the optimum is B, 60.
    const inst = base({ mustChoose: Uint8Array.from([0, 1]) });
    for (const m of ['exact', 'fast'] as const) {
      const s = solvePlan(inst, m, highs);
      expect(Array.from(s.pick), m).toEqual([-1, 1]);
      expect(s.objective, m).toBe(60);
    }
    expect(solveBruteForce(inst)!.objective).toBe(60);
  });
  it('least life-cycle cost with a target: the cheaper way to meet it (worked by hand)', () => {
    // Target: gain ≥ 25 in year 1; A gains 10 (lcc 50), B gains 30 (lcc 20). Only B meets it: lcc 20.
    // Without the target doing nothing costs 0 over do-nothing, the minimum.
    const target = {
      label: 'network PCI ≥ 65 in 2028',
      year: 1,
      rhs: 25,
      idx: Int32Array.from([0, 1]),
      gain: Float64Array.from([10, 30]),
    };
    const inst = base({ objective: 'cost', targets: [target] });
    for (const m of ['exact', 'fast'] as const) {
      const s = solvePlan(inst, m, highs);
      expect(Array.from(s.pick), m).toEqual([-1, 1]);
      expect(s.objective, m).toBe(20);
      expect(s.targetsMissed, m).toEqual([]);
    }
    const free = solvePlan(base({ objective: 'cost' }), 'exact', highs);
    expect(free.objective).toBe(0);
    // An unreachable target: worst-first (which ignores targets) names it.
    const hard = base({ objective: 'cost', targets: [{ ...target, rhs: 35 }] });
    const rank = solvePlan(hard, 'ranking', null);
    expect(rank.targetsMissed).toEqual(['network PCI ≥ 65 in 2028']);
    expect(() => solvePlan(hard, 'exact', highs)).toThrow(/network PCI ≥ 65 in 2028/);
  });
});
