// Choosing work under yearly budgets (docs/COMPUTATION.md, the budget plan): each segment takes
// at most one option (a treatment path, spending in one or several years) or
// nothing; maximise total benefit so that no year's spending exceeds its
// budget. A multiple-choice knapsack with one capacity per year.

export type OptOption = {
  id: string;
  benefit: number;
  costs: { year: number; cost: number }[];
  /** Optional: what choosing it adds to the floor rows' left-hand side, by year (e.g. length × PCI gained). */
  floorGains?: number[];
};
/** Optional rows Σ floorGains[year]·x ≥ rhs (a minimum network PCI); only the exact method enforces them. */
export type Floor = { year: number; rhs: number };
export type OptSegment = { id: string; options: OptOption[]; priority?: number };
export type Instance = { budgets: number[]; segments: OptSegment[]; floors?: Floor[] };
export type Method = 'exact' | 'fast' | 'ranking';

export type Solution = {
  method: Method;
  chosen: { segmentId: string; optionId: string }[];
  totalBenefit: number;
  spentByYear: number[];
  /** Best known upper bound on the total benefit. */
  bound: number;
  /** (bound − totalBenefit) / bound. */
  gap: number;
  status: string;
};

const EPS = 1e-9;

export function spending(inst: Instance, pick: (number | -1)[]) {
  const spent = new Array(inst.budgets.length).fill(0);
  let benefit = 0;
  pick.forEach((j, i) => {
    if (j < 0) return;
    const o = inst.segments[i].options[j];
    benefit += o.benefit;
    for (const c of o.costs) spent[c.year] += c.cost;
  });
  return { spent, benefit };
}

export function feasible(inst: Instance, pick: (number | -1)[]) {
  const { spent } = spending(inst, pick);
  return spent.every((s, y) => s <= inst.budgets[y] * (1 + 1e-9) + EPS);
}

function solution(inst: Instance, method: Method, pick: (number | -1)[], bound: number, status: string): Solution {
  const { spent, benefit } = spending(inst, pick);
  const b = Math.max(bound, benefit);
  return {
    method,
    chosen: pick.flatMap((j, i) =>
      j < 0 ? [] : [{ segmentId: inst.segments[i].id, optionId: inst.segments[i].options[j].id }],
    ),
    totalBenefit: benefit,
    spentByYear: spent,
    bound: b,
    gap: b > 0 ? (b - benefit) / b : 0,
    status,
  };
}

/** Options that can never be afforded, or bring no benefit, are dropped up front. */
function usable(inst: Instance) {
  return inst.segments.map((s) =>
    s.options
      .map((o, j) => ({ o, j }))
      .filter(
        ({ o }) =>
          o.benefit > 0 &&
          o.costs.every((c) => c.year >= 0 && c.year < inst.budgets.length && c.cost <= inst.budgets[c.year] + EPS),
      ),
  );
}

// ---- Lagrangian relaxation of the budget rows ------------------------------

/** Upper bound for multipliers λ ≥ 0, and each segment's best option under them. */
function lagrangian(inst: Instance, opts: ReturnType<typeof usable>, lambda: number[]) {
  let value = 0;
  for (let y = 0; y < lambda.length; y++) value += lambda[y] * inst.budgets[y];
  const pick: (number | -1)[] = [];
  for (const list of opts) {
    let best = 0;
    let bj = -1;
    for (const { o, j } of list) {
      let r = o.benefit;
      for (const c of o.costs) r -= lambda[c.year] * c.cost;
      if (r > best) {
        best = r;
        bj = j;
      }
    }
    value += best;
    pick.push(bj);
  }
  return { value, pick };
}

/** Drop the least efficient choices until every year fits, then add the best that still fit. */
function repairAndFill(inst: Instance, opts: ReturnType<typeof usable>, start: (number | -1)[], lambda: number[]) {
  const pick = [...start];
  const { spent } = spending(inst, pick);
  const price = (o: OptOption) =>
    o.costs.reduce((s, c) => s + c.cost * (lambda[c.year] + 1 / Math.max(1, inst.budgets[c.year])), 0);
  const over = () => spent.some((s, y) => s > inst.budgets[y] + EPS);
  if (over()) {
    const order = pick
      .map((j, i) => ({ i, j }))
      .filter((x) => x.j >= 0)
      .sort((x, y) => {
        const ox = inst.segments[x.i].options[x.j];
        const oy = inst.segments[y.i].options[y.j];
        return ox.benefit / price(ox) - oy.benefit / price(oy);
      });
    for (const { i, j } of order) {
      if (!over()) break;
      const o = inst.segments[i].options[j];
      if (!o.costs.some((c) => spent[c.year] > inst.budgets[c.year] + EPS)) continue;
      for (const c of o.costs) spent[c.year] -= c.cost;
      pick[i] = -1;
    }
  }
  // Fill: candidate moves (take an option, or upgrade to a better one) by gain per unit of scarce money.
  const moves: { i: number; j: number; gain: number; ratio: number }[] = [];
  opts.forEach((list, i) => {
    const cur = pick[i] >= 0 ? inst.segments[i].options[pick[i] as number] : null;
    for (const { o, j } of list) {
      const gain = o.benefit - (cur?.benefit ?? 0);
      if (gain <= EPS || j === pick[i]) continue;
      moves.push({ i, j, gain, ratio: gain / Math.max(EPS, price(o)) });
    }
  });
  moves.sort((a, b) => b.ratio - a.ratio);
  for (const m of moves) {
    const cur = pick[m.i] >= 0 ? inst.segments[m.i].options[pick[m.i] as number] : null;
    const o = inst.segments[m.i].options[m.j];
    if (o.benefit <= (cur?.benefit ?? 0)) continue;
    const delta = new Map<number, number>();
    for (const c of o.costs) delta.set(c.year, (delta.get(c.year) ?? 0) + c.cost);
    for (const c of cur?.costs ?? []) delta.set(c.year, (delta.get(c.year) ?? 0) - c.cost);
    let fits = true;
    for (const [y, d] of delta) if (spent[y] + d > inst.budgets[y] + EPS) fits = false;
    if (!fits) continue;
    for (const [y, d] of delta) spent[y] += d;
    pick[m.i] = m.j;
  }
  return pick;
}

/** Fast near-optimal method: subgradient on the Lagrangian dual, with a repair-and-fill heuristic. */
export function solveFast(
  inst: Instance,
  opts: { iterations?: number; onProgress?: (f: number) => void } = {},
): Solution {
  const list = usable(inst);
  const Y = inst.budgets.length;
  const iterations = opts.iterations ?? 150;
  let lambda = new Array(Y).fill(0);
  // Start the multipliers at the benefit-to-cost ratio money buys on average.
  let totalB = 0;
  let totalC = 0;
  for (const l of list)
    for (const { o } of l) {
      totalB += o.benefit;
      totalC += o.costs.reduce((s, c) => s + c.cost, 0);
    }
  lambda = lambda.map(() => (totalC > 0 ? (0.5 * totalB) / totalC : 0));
  let bestBound = Infinity;
  let bestPick: (number | -1)[] = list.map(() => -1);
  let bestValue = 0;
  let step = 1;
  for (let it = 0; it < iterations; it++) {
    const { value, pick } = lagrangian(inst, list, lambda);
    if (value < bestBound) bestBound = value;
    // The repair is the costly part: run it now and then, and stop once the gap is negligible.
    if (it % 15 === 4 || it === iterations - 1) {
      const cand = repairAndFill(inst, list, pick, lambda);
      const v = spending(inst, cand).benefit;
      if (v > bestValue && feasible(inst, cand)) {
        bestValue = v;
        bestPick = cand;
      }
    }
    if (bestValue > 0 && (bestBound - bestValue) / bestBound < 1e-5) break;
    const { spent } = spending(inst, pick);
    const g = spent.map((s, y) => inst.budgets[y] - s);
    const norm = g.reduce((s, v) => s + v * v, 0);
    if (norm < EPS) break;
    // Polyak step towards the best feasible value, shrinking when the bound stalls.
    const t = (step * (value - bestValue)) / norm;
    lambda = lambda.map((l, y) => Math.max(0, l - t * g[y]));
    if (it % 20 === 19) step *= 0.6;
    opts.onProgress?.((it + 1) / iterations);
  }
  return solution(
    inst,
    'fast',
    bestPick,
    Number.isFinite(bestBound) ? bestBound : bestValue,
    'near-optimal (Lagrangian bound)',
  );
}

/** Baseline: segments in priority order (worst first), each takes its best option that still fits. */
export function solveRanking(inst: Instance): Solution {
  const list = usable(inst);
  const order = inst.segments.map((s, i) => ({ i, p: s.priority ?? i })).sort((a, b) => a.p - b.p);
  const spent = new Array(inst.budgets.length).fill(0);
  const pick: (number | -1)[] = inst.segments.map(() => -1);
  for (const { i } of order) {
    const options = [...list[i]].sort((a, b) => b.o.benefit - a.o.benefit);
    for (const { o, j } of options) {
      if (o.costs.every((c) => spent[c.year] + c.cost <= inst.budgets[c.year] + EPS)) {
        for (const c of o.costs) spent[c.year] += c.cost;
        pick[i] = j;
        break;
      }
    }
  }
  const bound = solveFastBound(inst, list);
  return solution(inst, 'ranking', pick, bound, 'worst-first ranking');
}

function solveFastBound(inst: Instance, list: ReturnType<typeof usable>) {
  let best = Infinity;
  let lambda = new Array(inst.budgets.length).fill(0);
  for (let it = 0; it < 60; it++) {
    const { value, pick } = lagrangian(inst, list, lambda);
    best = Math.min(best, value);
    const { spent } = spending(inst, pick);
    const g = spent.map((s, y) => inst.budgets[y] - s);
    const norm = g.reduce((s, v) => s + v * v, 0);
    if (norm < EPS) break;
    lambda = lambda.map((l, y) => Math.max(0, l - ((value * 0.1) / norm / (1 + it * 0.2)) * g[y]));
  }
  return best;
}

/** Tries every combination: the independent reference for tiny instances in tests. */
export function solveBruteForce(inst: Instance): Solution {
  let best: (number | -1)[] = inst.segments.map(() => -1);
  let bestV = 0;
  const pick: (number | -1)[] = inst.segments.map(() => -1);
  const rec = (i: number) => {
    if (i === inst.segments.length) {
      if (feasible(inst, pick)) {
        const v = spending(inst, pick).benefit;
        if (v > bestV + EPS) {
          bestV = v;
          best = [...pick];
        }
      }
      return;
    }
    for (let j = -1; j < inst.segments[i].options.length; j++) {
      pick[i] = j;
      rec(i + 1);
    }
    pick[i] = -1;
  };
  rec(0);
  return solution(inst, 'exact', best, bestV, 'optimal (enumeration)');
}

// ---- Exact: mixed-integer programme solved by HiGHS -------------------------

/** The part of the `highs` package this module uses (passed in, so the engine does no loading itself). */
export type Highs = {
  solve: (lp: string, options?: never) => { Status: string; ObjectiveValue: number; Columns: Record<string, object> };
};

/** Writes the model in CPLEX LP format, one binary per (segment, option). */
export function toLp(inst: Instance) {
  const list = usable(inst);
  const lines: string[] = ['Maximize', ' obj:'];
  const obj: string[] = [];
  const budgetTerms: string[][] = inst.budgets.map(() => []);
  const segRows: string[] = [];
  const names: string[] = [];
  list.forEach((l, i) => {
    const vars: string[] = [];
    for (const { o, j } of l) {
      const v = `x${i}_${j}`;
      names.push(v);
      vars.push(v);
      obj.push(`+ ${o.benefit} ${v}`);
      for (const c of o.costs) if (c.cost > 0) budgetTerms[c.year].push(`+ ${c.cost} ${v}`);
    }
    if (vars.length > 1) segRows.push(` s${i}: ${vars.join(' + ')} <= 1`);
  });
  const wrap = (terms: string[]) => {
    const out: string[] = [];
    for (let k = 0; k < terms.length; k += 50) out.push(`  ${terms.slice(k, k + 50).join(' ')}`);
    return out;
  };
  lines.push(...(obj.length ? wrap(obj) : ['  0 x_empty']));
  lines.push('Subject To');
  lines.push(...segRows);
  inst.budgets.forEach((b, y) => {
    if (budgetTerms[y].length === 0) return;
    lines.push(` b${y}:`);
    lines.push(...wrap(budgetTerms[y]));
    lines.push(`  <= ${b}`);
  });
  for (const f of inst.floors ?? []) {
    const terms: string[] = [];
    list.forEach((l, i) => {
      for (const { o, j } of l) {
        const g = o.floorGains?.[f.year] ?? 0;
        if (g > 0) terms.push(`+ ${g} x${i}_${j}`);
      }
    });
    if (terms.length === 0) {
      if (f.rhs > 0)
        throw new Error(`the minimum network PCI cannot be reached in year ${f.year + 1}: no work can lift it`);
      continue;
    }
    lines.push(` f${f.year}:`);
    lines.push(...wrap(terms));
    lines.push(`  >= ${f.rhs}`);
  }
  lines.push('Binary');
  lines.push(...wrap(names.length ? names : ['x_empty']));
  lines.push('End');
  return { lp: lines.join('\n'), list };
}

export function solveExact(
  inst: Instance,
  highs: Highs,
  opts: { timeLimitSeconds?: number; gap?: number } = {},
): Solution {
  const { lp, list } = toLp(inst);
  if (list.every((l) => l.length === 0))
    return solution(
      inst,
      'exact',
      inst.segments.map(() => -1),
      0,
      'optimal (nothing affordable)',
    );
  const res = highs.solve(lp, {
    output_flag: false,
    time_limit: opts.timeLimitSeconds ?? 60,
    mip_rel_gap: opts.gap ?? 1e-6,
    presolve: 'on',
  } as never);
  if (res.Status === 'Infeasible')
    throw new Error(
      'no choice of work meets every year’s budget and the minimum network PCI; raise the budgets or lower the minimum (Find the budget helps)',
    );
  if (res.Status !== 'Optimal' && res.Status !== 'Time limit reached')
    throw new Error(`HiGHS ended with status: ${res.Status}`);
  const pick: (number | -1)[] = list.map((l, i) => {
    for (const { j } of l)
      if (((res.Columns[`x${i}_${j}`] as { Primal?: number } | undefined)?.Primal ?? 0) > 0.5) return j;
    return -1;
  });
  const optimal = res.Status === 'Optimal';
  // At a time limit the Lagrangian dual gives a valid bound on the optimum.
  const bound = optimal
    ? spending(inst, pick).benefit
    : Math.min(solveFastBound(inst, list), solveFast(inst, { iterations: 60 }).bound);
  return solution(
    inst,
    'exact',
    pick,
    bound,
    optimal ? 'optimal (HiGHS)' : 'time limit reached (HiGHS); bound from the Lagrangian dual',
  );
}
