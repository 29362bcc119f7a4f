// "What flat annual budget reaches PCI X?" (docs/COMPUTATION.md, the budget plan). The search
// knows nothing of the model: it calls `evaluate(budget)` for the network PCI of every plan
// year. Rules: 'hold-every-year' needs every year's PCI at or above the target (not only the
// last); 'final-year' needs the last year's. The answer is the smallest budget tried that meets
// the rule, with a failing budget below it no further than $1,000 or 0.1 % of the answer,
// whichever is larger. It assumes that more money never makes the rule fail (true of the exact
// method; the fast and worst-first methods can break it by a hair, so every point tried is
// returned for the chart, and the answer is always a budget that was seen to meet the rule).

export type BudgetSearchResult = {
  /** Smallest flat annual budget found that meets the rule; null when even maxBudget does not. */
  budget: number | null;
  reachable: boolean;
  /** Every budget evaluated, in ascending order of budget. */
  points: { budget: number; finalPci: number; minPci: number }[];
  /** Plain words of the precision reached. */
  tolerance: string;
};

const usd = (x: number) => `$${Math.round(x).toLocaleString('en-US')}`;

export function findBudget(
  evaluate: (annualBudget: number) => { pciByYear: number[] },
  opts: {
    targetPci: number;
    rule: 'hold-every-year' | 'final-year';
    maxBudget: number;
    onProgress?: (f: number) => void;
  },
): BudgetSearchResult {
  const { targetPci, rule } = opts;
  const maxBudget = Math.max(0, opts.maxBudget);
  const points: BudgetSearchResult['points'] = [];
  const tol = (hi: number) => Math.max(1000, 0.001 * hi);
  // Evaluations expected: the scan plus bisection from the scan's step down to the tolerance.
  const levels = 8;
  const expected = levels + 2 + Math.ceil(Math.log2(Math.max(2, maxBudget / levels / 1000)));
  let done = 0;
  const meets = (b: number) => {
    const { pciByYear } = evaluate(b);
    if (pciByYear.length === 0) throw new Error('the plan has no years to test');
    const finalPci = pciByYear[pciByYear.length - 1];
    const minPci = Math.min(...pciByYear);
    points.push({ budget: b, finalPci, minPci });
    opts.onProgress?.(Math.min(0.99, ++done / expected));
    return rule === 'hold-every-year' ? minPci >= targetPci : finalPci >= targetPci;
  };
  const finish = (r: Omit<BudgetSearchResult, 'points'>): BudgetSearchResult => {
    points.sort((a, b) => a.budget - b.budget);
    opts.onProgress?.(1);
    return { ...r, points };
  };
  const ruleWords =
    rule === 'hold-every-year'
      ? `every year at PCI ${targetPci} or better`
      : `PCI ${targetPci} or better in the last year`;
  if (!meets(maxBudget))
    return finish({
      budget: null,
      reachable: false,
      tolerance: `not reachable: even ${usd(maxBudget)} a year does not keep ${ruleWords}`,
    });
  if (meets(0)) return finish({ budget: 0, reachable: true, tolerance: `exact: no money is needed for ${ruleWords}` });
  // A coarse scan (also the chart's points), then bisection between the last failing and first passing budgets.
  let lo = 0;
  let hi = maxBudget;
  for (let i = 1; i < levels; i++) {
    const b = maxBudget * (i / levels) ** 2;
    if (meets(b)) {
      hi = b;
      break;
    }
    lo = b;
  }
  while (hi - lo > tol(hi)) {
    const mid = (lo + hi) / 2;
    if (meets(mid)) hi = mid;
    else lo = mid;
  }
  return finish({
    budget: hi,
    reachable: true,
    tolerance: `to within $1,000 or 0.1 %, whichever is larger: ${usd(lo)} a year fails and ${usd(hi)} a year keeps ${ruleWords}`,
  });
}
