// One door to the three methods on a packed instance (the plan contract, docs/COMPUTATION.md).
import { type Highs, solveExact } from './exact';
import { solveFast } from './fast';
import type { PackedInstance, PlanSolution } from './instance';
import { solveRanking } from './ranking';

export type { Highs } from './exact';

export function solvePlan(
  inst: PackedInstance,
  method: 'exact' | 'fast' | 'ranking',
  highs: Highs | null,
  opts: { timeLimitSeconds?: number; iterations?: number; onProgress?: (f: number) => void; mipRelGap?: number } = {},
): PlanSolution {
  checkInstance(inst);
  if (method === 'exact') {
    if (!highs) throw new Error('the exact method needs the HiGHS solver');
    const s = solveExact(inst, highs, { timeLimitSeconds: opts.timeLimitSeconds, mipRelGap: opts.mipRelGap });
    opts.onProgress?.(1);
    return s;
  }
  if (method === 'fast') return solveFast(inst, { iterations: opts.iterations, onProgress: opts.onProgress });
  const s = solveRanking(inst);
  opts.onProgress?.(1);
  return s;
}

/** The packed arrays agree in length (a programming error otherwise, not a user's). */
function checkInstance(inst: PackedInstance) {
  const n = inst.segStart[inst.nSegments];
  const bad = (what: string) => {
    throw new Error(`packed plan instance: ${what}`);
  };
  if (inst.budgets.length !== inst.years) bad('budgets must have one value per year');
  if (inst.segStart.length !== inst.nSegments + 1 || inst.segStart[0] !== 0)
    bad('segStart must have nSegments + 1 entries from 0');
  if (inst.benefit.length !== n || inst.lcc.length !== n) bad('benefit and lcc need one value per option');
  if (inst.cost.length !== n * inst.years) bad('cost needs options × years values');
  if (inst.priority.length !== inst.nSegments || inst.mustChoose.length !== inst.nSegments)
    bad('priority and mustChoose need one value per segment');
  for (const t of inst.targets) {
    if (t.idx.length !== t.gain.length)
      bad(`target “${t.label}” has ${t.idx.length} indices and ${t.gain.length} gains`);
    for (let k = 0; k < t.idx.length; k++)
      if (t.idx[k] < 0 || t.idx[k] >= n) bad(`target “${t.label}” names option ${t.idx[k]}`);
  }
}
