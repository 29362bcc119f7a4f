// Choosing work under yearly budgets, object form (docs/COMPUTATION.md, the budget plan): each
// segment takes at most one option (a treatment path, spending in one or several years) or
// nothing; maximise total benefit so that no year's spending exceeds its budget. This module
// keeps the object form the stateless endpoint and older callers use; it packs the instance
// (shared/engine/plan/instance.ts) and hands it to the methods in solve.ts.
import { solveBruteForce as bruteForcePacked } from './brute-force';
import type { PackedInstance, PlanSolution, TargetRow } from './instance';
import { solvePlan } from './solve';

export type { Highs } from './exact';

import type { Highs } from './exact';

export type OptOption = {
  id: string;
  benefit: number;
  /** Spending by plan year; a year listed twice counts both amounts. */
  costs: { year: number; cost: number }[];
  /** Optional: what choosing it adds to the floor rows' left-hand side, by year (e.g. length × PCI gained). */
  floorGains?: number[];
};
/** Optional rows Σ floorGains[year]·x ≥ rhs (a minimum network PCI). */
export type Floor = { year: number; rhs: number };
export type OptSegment = { id: string; options: OptOption[]; priority?: number };
export type Instance = { budgets: number[]; segments: OptSegment[]; floors?: Floor[] };
export type Method = 'exact' | 'fast' | 'ranking';

export type Solution = {
  method: Method;
  chosen: { segmentId: string; optionId: string }[];
  totalBenefit: number;
  spentByYear: number[];
  /** Best known upper bound on the total benefit (HiGHS's dual bound, or the Lagrangian one). */
  bound: number;
  /** (bound − totalBenefit) / bound. */
  gap: number;
  status: string;
  /** Floors (minimum network PCI rows) the solution does not meet. */
  targetsMissed: string[];
};

/** The object form packed into typed arrays; costs listed twice for one year are added up. */
export function pack(inst: Instance): PackedInstance {
  const Y = inst.budgets.length;
  const nSegments = inst.segments.length;
  const segStart = new Int32Array(nSegments + 1);
  inst.segments.forEach((s, i) => {
    segStart[i + 1] = segStart[i] + s.options.length;
  });
  const n = segStart[nSegments];
  const benefit = new Float64Array(n);
  const cost = new Float64Array(n * Y);
  const priority = new Float64Array(nSegments);
  const floors = inst.floors ?? [];
  const tIdx: number[][] = floors.map(() => []);
  const tGain: number[][] = floors.map(() => []);
  inst.segments.forEach((s, i) => {
    priority[i] = s.priority ?? i;
    s.options.forEach((o, j) => {
      const k = segStart[i] + j;
      benefit[k] = o.benefit;
      for (const c of o.costs) {
        if (c.year < 0 || c.year >= Y) throw new Error(`option ${o.id} spends in year ${c.year}, outside the plan`);
        cost[k * Y + c.year] += c.cost;
      }
      floors.forEach((f, r) => {
        const g = o.floorGains?.[f.year] ?? 0;
        if (g !== 0) {
          tIdx[r].push(k);
          tGain[r].push(g);
        }
      });
    });
  });
  const targets: TargetRow[] = floors.map((f, r) => ({
    label: `minimum network PCI in plan year ${f.year + 1}`,
    year: f.year,
    rhs: f.rhs,
    idx: Int32Array.from(tIdx[r]),
    gain: Float64Array.from(tGain[r]),
  }));
  return {
    years: Y,
    budgets: Float64Array.from(inst.budgets),
    nSegments,
    segStart,
    benefit,
    lcc: new Float64Array(n),
    cost,
    priority,
    mustChoose: new Uint8Array(nSegments),
    targets,
    objective: 'benefit',
  };
}

/** A packed solution back in the object form's terms. */
export function unpack(inst: Instance, packed: PackedInstance, s: PlanSolution): Solution {
  const chosen: Solution['chosen'] = [];
  for (let i = 0; i < inst.segments.length; i++) {
    const o = s.pick[i];
    if (o < 0) continue;
    chosen.push({ segmentId: inst.segments[i].id, optionId: inst.segments[i].options[o - packed.segStart[i]].id });
  }
  return {
    method: s.method,
    chosen,
    totalBenefit: s.objective,
    spentByYear: Array.from(s.spentByYear),
    bound: s.bound,
    gap: s.gap,
    status: s.status,
    targetsMissed: s.targetsMissed,
  };
}

const via = (inst: Instance, method: Method, highs: Highs | null, opts: Parameters<typeof solvePlan>[3]) => {
  const p = pack(inst);
  return unpack(inst, p, solvePlan(p, method, highs, opts));
};

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
  return spent.every((s, y) => s <= inst.budgets[y] * (1 + 1e-9) + 1e-9);
}

/** Fast near-optimal method (Lagrangian relaxation; shared/engine/plan/fast.ts). */
export function solveFast(inst: Instance, opts: { iterations?: number; onProgress?: (f: number) => void } = {}) {
  return via(inst, 'fast', null, opts);
}

/** Baseline: segments in priority order (worst first), each takes its best option that still fits. */
export function solveRanking(inst: Instance) {
  return via(inst, 'ranking', null, {});
}

/** Exact: the mixed-integer programme solved by HiGHS, with HiGHS's own dual bound and gap. */
export function solveExact(inst: Instance, highs: Highs, opts: { timeLimitSeconds?: number; gap?: number } = {}) {
  return via(inst, 'exact', highs, { timeLimitSeconds: opts.timeLimitSeconds, mipRelGap: opts.gap });
}

/** Tries every combination: the independent reference for tiny instances in tests. */
export function solveBruteForce(inst: Instance): Solution {
  const p = pack(inst);
  const s = bruteForcePacked(p);
  if (!s) throw new Error('no combination meets every budget and floor');
  return unpack(inst, p, s);
}
