// THROW-AWAY ADAPTER (plan-strategies branch only): solvePlan with the contract's signature, on the
// old solvers of optimize.ts, so the strategy generator can be run end to end. The plan-solver branch
// writes the real solve.ts (HiGHS's dual bound, target rows in every method, the cost objective);
// at merge the lead keeps that one. Here: network-PCI rows reach the exact method as its floors, the
// cost objective is not optimised (the benefit is), and every missed row is reported.
import type { PackedInstance, PlanSolution } from './instance';
import { type Highs, type Instance, solveExact, solveFast, solveRanking } from './optimize';

export function toLegacy(inst: PackedInstance): Instance {
  const Y = inst.years;
  const floorRows = inst.targets.filter((r) => r.label.startsWith('network PCI'));
  const gainOf = new Map<number, number[]>();
  for (const r of floorRows)
    r.idx.forEach((o, k) => {
      let g = gainOf.get(o);
      if (!g) {
        g = new Array(Y).fill(0);
        gainOf.set(o, g);
      }
      g[r.year] = Math.max(0, r.gain[k]);
    });
  const segments: Instance['segments'] = [];
  for (let i = 0; i < inst.nSegments; i++) {
    const options: Instance['segments'][number]['options'] = [];
    for (let o = inst.segStart[i]; o < inst.segStart[i + 1]; o++) {
      const costs: { year: number; cost: number }[] = [];
      for (let y = 0; y < Y; y++) if (inst.cost[o * Y + y] > 0) costs.push({ year: y, cost: inst.cost[o * Y + y] });
      if (costs.length === 0) costs.push({ year: 0, cost: 0 });
      options.push({ id: String(o), benefit: inst.benefit[o], costs, floorGains: gainOf.get(o) });
    }
    segments.push({ id: String(i), options, priority: inst.priority[i] });
  }
  return {
    budgets: Array.from(inst.budgets),
    segments,
    floors: floorRows.map((r) => ({ year: r.year, rhs: r.rhs })).filter((f) => f.rhs > 0),
  };
}

export function solvePlan(
  inst: PackedInstance,
  method: 'exact' | 'fast' | 'ranking',
  highs: Highs | null,
  opts: { timeLimitSeconds?: number; iterations?: number; onProgress?: (f: number) => void } = {},
): PlanSolution {
  const legacy = toLegacy(inst);
  let s: ReturnType<typeof solveFast>;
  if (method === 'exact') {
    if (!highs) throw new Error('the exact method needs the HiGHS solver');
    s = solveExact(legacy, highs, { timeLimitSeconds: opts.timeLimitSeconds ?? 60, gap: 1e-4 });
  } else if (method === 'fast') s = solveFast(legacy, { iterations: opts.iterations, onProgress: opts.onProgress });
  else s = solveRanking(legacy);
  const pick = new Int32Array(inst.nSegments).fill(-1);
  for (const c of s.chosen) pick[Number(c.segmentId)] = Number(c.optionId);
  const x = new Uint8Array(inst.benefit.length);
  for (const o of pick) if (o >= 0) x[o] = 1;
  const targetsMissed: string[] = [];
  for (const r of inst.targets) {
    let lhs = 0;
    r.idx.forEach((o, k) => {
      if (x[o]) lhs += r.gain[k];
    });
    if (lhs < r.rhs - 1e-6 * Math.max(1, Math.abs(r.rhs))) targetsMissed.push(r.label);
  }
  let forced = 0;
  for (let i = 0; i < inst.nSegments; i++) if (inst.mustChoose[i] && pick[i] < 0) forced++;
  if (forced) targetsMissed.push(`${forced} segment(s) left below their class's PCI floor`);
  let lcc = 0;
  for (const o of pick) if (o >= 0) lcc += inst.lcc[o];
  return {
    method,
    pick,
    objective: inst.objective === 'cost' ? lcc : s.totalBenefit,
    bound: s.bound,
    gap: s.gap,
    spentByYear: Float64Array.from(s.spentByYear),
    targetsMissed,
    status: s.status,
  };
}
