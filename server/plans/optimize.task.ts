// The stateless optimiser (POST /api/plan/optimize), every method, in a worker.
import { type Instance, solveExact, solveFast, solveRanking } from '../../shared/engine/plan/optimize';
import type { OptimizeBody } from '../../shared/schemas/plans';
import { defineTask } from '../pool/task';
import { loadSolver } from './highs';

export default defineTask(async (body: OptimizeBody) => {
  const inst: Instance = {
    budgets: body.budgets,
    segments: body.segments.map((s) => ({
      id: s.id,
      priority: s.priority,
      options: s.options.map((o) => ({
        id: o.id,
        benefit: o.benefit,
        costs: o.costs ?? [{ year: o.year!, cost: o.cost! }],
      })),
    })),
  };
  if (body.method === 'exact') return solveExact(inst, await loadSolver(), { timeLimitSeconds: body.timeLimitSeconds });
  return body.method === 'fast' ? solveFast(inst) : solveRanking(inst);
});
