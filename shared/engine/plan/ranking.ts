// The worst-first baseline (docs/COMPUTATION.md, the budget plan): segments in priority order
// (today's PCI, lowest first), each takes its most beneficial option that still fits every
// year's money. It knows nothing of targets or life-cycle cost; it lists the targets it misses.
// Its bound is the Lagrangian one, so its gap says how far the habit is from the optimum.
import { compile, solutionOf, TOL } from './compiled';
import { lagrangianBound } from './fast';
import type { PackedInstance, PlanSolution } from './instance';

export function solveRanking(inst: PackedInstance): PlanSolution {
  const c = compile(inst);
  const order = Array.from({ length: inst.nSegments }, (_, i) => i).sort(
    (a, b) => inst.priority[a] - inst.priority[b] || a - b,
  );
  const spent = new Float64Array(c.Y);
  const pick = new Int32Array(inst.nSegments).fill(-1);
  for (const i of order) {
    let bo = -1;
    let bv = inst.mustChoose[i] ? Number.NEGATIVE_INFINITY : 0;
    for (let o = inst.segStart[i]; o < inst.segStart[i + 1]; o++) {
      if (!c.usable[o] || !(inst.benefit[o] > bv)) continue;
      let fits = true;
      for (let k = c.cStart[o]; k < c.cStart[o + 1]; k++)
        if (spent[c.cYear[k]] + c.cVal[k] > inst.budgets[c.cYear[k]] * (1 + TOL) + TOL) fits = false;
      if (!fits) continue;
      bv = inst.benefit[o];
      bo = o;
    }
    if (bo < 0) continue;
    pick[i] = bo;
    for (let k = c.cStart[bo]; k < c.cStart[bo + 1]; k++) spent[c.cYear[k]] += c.cVal[k];
  }
  const s = solutionOf(inst, c, 'ranking', pick, lagrangianBound(inst, 60, c), 'worst-first ranking');
  if (s.targetsMissed.length) s.status = `worst-first ranking; missed: ${s.targetsMissed.join('; ')}`;
  return s;
}
