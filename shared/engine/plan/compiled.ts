// What the three methods share: the packed instance read once into sparse, typed form
// (costs by year and target gains per option), and the plain check of a choice against
// every year's budget and every target row (docs/COMPUTATION.md, the budget plan).
import { optionCount, type PackedInstance, type PlanSolution } from './instance';

/** Relative slack allowed on a budget or a target (floating-point sums of dollars and PCI·lane-miles). */
export const TOL = 1e-9;

export type Compiled = {
  Y: number;
  R: number;
  nOpt: number;
  /** Value maximised: benefit, or −lcc for the 'cost' objective. */
  value: Float64Array;
  /** 1 where each of the option's own yearly costs fits that year's budget (others can never be chosen). */
  usable: Uint8Array;
  /** Option o spends cVal[k] in year cYear[k], k = cStart[o] … cStart[o+1]−1 (non-zero costs only). */
  cStart: Int32Array;
  cYear: Int32Array;
  cVal: Float64Array;
  /** Option o adds gVal[k] to target row gRow[k], k = gStart[o] … gStart[o+1]−1. */
  gStart: Int32Array;
  gRow: Int32Array;
  gVal: Float64Array;
};

export function compile(inst: PackedInstance): Compiled {
  const Y = inst.years;
  const R = inst.targets.length;
  const nOpt = optionCount(inst);
  const value = new Float64Array(nOpt);
  const usable = new Uint8Array(nOpt);
  const cStart = new Int32Array(nOpt + 1);
  let nnz = 0;
  for (let o = 0; o < nOpt; o++) {
    let ok = 1;
    for (let y = 0; y < Y; y++) {
      const c = inst.cost[o * Y + y];
      if (c !== 0) {
        nnz++;
        if (!(c <= inst.budgets[y] * (1 + TOL) + TOL)) ok = 0;
      }
    }
    usable[o] = ok;
    cStart[o + 1] = nnz;
    value[o] = inst.objective === 'cost' ? -inst.lcc[o] : inst.benefit[o];
  }
  const cYear = new Int32Array(nnz);
  const cVal = new Float64Array(nnz);
  for (let o = 0, k = 0; o < nOpt; o++)
    for (let y = 0; y < Y; y++) {
      const c = inst.cost[o * Y + y];
      if (c !== 0) {
        cYear[k] = y;
        cVal[k++] = c;
      }
    }
  // Target rows are given by row; the methods read them by option.
  const gStart = new Int32Array(nOpt + 1);
  for (const t of inst.targets) for (let k = 0; k < t.idx.length; k++) gStart[t.idx[k] + 1]++;
  for (let o = 0; o < nOpt; o++) gStart[o + 1] += gStart[o];
  const fill = gStart.slice(0, nOpt);
  const gRow = new Int32Array(gStart[nOpt]);
  const gVal = new Float64Array(gStart[nOpt]);
  inst.targets.forEach((t, r) => {
    for (let k = 0; k < t.idx.length; k++) {
      const at = fill[t.idx[k]]++;
      gRow[at] = r;
      gVal[at] = t.gain[k];
    }
  });
  return { Y, R, nOpt, value, usable, cStart, cYear, cVal, gStart, gRow, gVal };
}

/** Spending by year, target rows' left-hand sides and the objective of a choice. */
export function evaluate(inst: PackedInstance, c: Compiled, pick: Int32Array) {
  const spent = new Float64Array(c.Y);
  const lhs = new Float64Array(c.R);
  let benefit = 0;
  let lcc = 0;
  for (let i = 0; i < inst.nSegments; i++) {
    const o = pick[i];
    if (o < 0) continue;
    benefit += inst.benefit[o];
    lcc += inst.lcc[o];
    for (let k = c.cStart[o]; k < c.cStart[o + 1]; k++) spent[c.cYear[k]] += c.cVal[k];
    for (let k = c.gStart[o]; k < c.gStart[o + 1]; k++) lhs[c.gRow[k]] += c.gVal[k];
  }
  const overspent: number[] = [];
  for (let y = 0; y < c.Y; y++) if (spent[y] > inst.budgets[y] * (1 + TOL) + 1e-6) overspent.push(y);
  const targetsMissed: string[] = [];
  inst.targets.forEach((t, r) => {
    if (lhs[r] < t.rhs - Math.abs(t.rhs) * 1e-7 - 1e-6) targetsMissed.push(t.label);
  });
  const mustMissed: number[] = [];
  for (let i = 0; i < inst.nSegments; i++) if (inst.mustChoose[i] && pick[i] < 0) mustMissed.push(i);
  return {
    spent,
    lhs,
    benefit,
    lcc,
    objective: inst.objective === 'cost' ? lcc : benefit,
    overspent,
    targetsMissed,
    mustMissed,
  };
}

/** The solution record, with the gap as the contract defines it: |bound − objective| / max(|bound|, tiny). */
export function solutionOf(
  inst: PackedInstance,
  c: Compiled,
  method: PlanSolution['method'],
  pick: Int32Array,
  bound: number,
  status: string,
): PlanSolution {
  const e = evaluate(inst, c, pick);
  // A bound is never on the wrong side of a feasible objective; rounding can put it a hair across.
  const feasible = e.overspent.length === 0 && e.targetsMissed.length === 0 && e.mustMissed.length === 0;
  let b = bound;
  if (feasible) b = inst.objective === 'cost' ? Math.min(b, e.objective) : Math.max(b, e.objective);
  const missed = [...e.targetsMissed];
  if (e.mustMissed.length)
    missed.push(
      `${e.mustMissed.length.toLocaleString('en-US')} segment${e.mustMissed.length === 1 ? '' : 's'} that must take work got none`,
    );
  return {
    method,
    pick,
    objective: e.objective,
    bound: b,
    gap: Math.abs(b - e.objective) / Math.max(Math.abs(b), 1e-12),
    spentByYear: e.spent,
    targetsMissed: missed,
    status,
  };
}
