// THROW-AWAY (plan-strategies branch only): findBudget with the contract's signature, so run-plan.ts
// can be wired and tested. The plan-solver branch writes the real one; at merge the lead keeps that.
// Bisection on a flat annual budget until the bracket is within $1,000 or 0.1 % of the budget.
export function findBudget(
  evaluate: (annualBudget: number) => { pciByYear: number[] },
  opts: {
    targetPci: number;
    rule: 'hold-every-year' | 'final-year';
    maxBudget: number;
    onProgress?: (f: number) => void;
  },
) {
  const points: { budget: number; finalPci: number; minPci: number }[] = [];
  const test = (b: number) => {
    const { pciByYear } = evaluate(b);
    const p = { budget: b, finalPci: pciByYear[pciByYear.length - 1], minPci: Math.min(...pciByYear) };
    points.push(p);
    return (opts.rule === 'hold-every-year' ? p.minPci : p.finalPci) >= opts.targetPci - 1e-9;
  };
  const tolerance = 'to $1,000 or 0.1 % of the budget, whichever is larger';
  if (!test(opts.maxBudget)) return { budget: null, reachable: false, points, tolerance };
  let lo = 0;
  let hi = opts.maxBudget;
  if (test(0)) hi = 0;
  for (let k = 0; k < 60 && hi - lo > Math.max(1000, 0.001 * hi); k++) {
    const mid = (lo + hi) / 2;
    if (test(mid)) hi = mid;
    else lo = mid;
    opts.onProgress?.(Math.min(0.99, (k + 1) / 30));
  }
  points.sort((a, b) => a.budget - b.budget);
  return { budget: hi as number | null, reachable: true, points, tolerance };
}
