// Worker for the plan benchmark: HiGHS on one instance, so the parent can stop it from outside.
import { parentPort, workerData } from 'node:worker_threads';
import loadHighs from 'highs';
import { type Highs, type Instance, solveExact } from '../shared/engine/plan/optimize';

const { instance, limit } = workerData.payload as { instance: Instance; limit: number };
const highs = (await loadHighs()) as unknown as Highs;
try {
  const s = solveExact(instance, highs, { timeLimitSeconds: limit, gap: 1e-4 });
  parentPort!.postMessage({ ok: true, status: s.status, benefit: s.totalBenefit });
} catch (err) {
  parentPort!.postMessage({ ok: false, message: (err as Error).message });
}
