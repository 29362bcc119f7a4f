// Pool task for the plan benchmark: HiGHS on one instance, so the parent can stop it from outside.
import loadHighs from 'highs';
import { type Highs, type Instance, solveExact } from '../shared/engine/plan/optimize';
import { defineTask } from '../server/pool/task';

export default defineTask(async ({ instance, limit }: { instance: Instance; limit: number }) => {
  const highs = (await loadHighs()) as unknown as Highs;
  const s = solveExact(instance, highs, { timeLimitSeconds: limit, gap: 1e-4 });
  return { status: s.status, benefit: s.totalBenefit };
});
