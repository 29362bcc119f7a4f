// Pool task for benchmarks: HiGHS on one object-form instance, so the parent can stop it from outside.
import loadHighs from 'highs';
import { type Instance, solveExact } from '../shared/engine/plan/optimize';
import { defineTask } from '../server/pool/task';

export default defineTask(async ({ instance, limit }: { instance: Instance; limit: number }) => {
  const highs = await loadHighs();
  const s = solveExact(instance, highs, { timeLimitSeconds: limit, gap: 1e-4 });
  return { status: s.status, benefit: s.totalBenefit, bound: s.bound, gap: s.gap };
});
