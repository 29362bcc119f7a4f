// Every combination tried: the independent reference for tiny instances in tests (at most a few
// thousand combinations). Budgets, targets and mustChoose are all checked by plain summation.
import { compile, evaluate, solutionOf } from './compiled';
import type { PackedInstance, PlanSolution } from './instance';

export function solveBruteForce(inst: PackedInstance): PlanSolution | null {
  const c = compile(inst);
  let combos = 1;
  for (let i = 0; i < inst.nSegments; i++) combos *= inst.segStart[i + 1] - inst.segStart[i] + 1;
  if (combos > 2_000_000) throw new Error(`brute force: ${combos} combinations is too many`);
  const pick = new Int32Array(inst.nSegments).fill(-1);
  let best: Int32Array | null = null;
  let bestV = 0;
  const sign = inst.objective === 'cost' ? -1 : 1;
  const rec = (i: number) => {
    if (i === inst.nSegments) {
      const e = evaluate(inst, c, pick);
      if (e.overspent.length || e.targetsMissed.length || e.mustMissed.length) return;
      const v = sign * e.objective;
      if (best === null || v > bestV + 1e-9) {
        bestV = v;
        best = pick.slice();
      }
      return;
    }
    for (let o = inst.segStart[i] - 1; o < inst.segStart[i + 1]; o++) {
      pick[i] = o < inst.segStart[i] ? -1 : o;
      rec(i + 1);
    }
    pick[i] = -1;
  };
  rec(0);
  if (best === null) return null;
  return solutionOf(inst, c, 'exact', best, sign * bestV, 'optimal (enumeration)');
}
