// Worker task: one plan run, or a budget search, from its input snapshot.
import { parentPort, workerData } from 'node:worker_threads';
import loadHighs from 'highs';
import { budgetSearch, type PlanInput, runPlan } from '../../shared/engine/plan/run-plan';
import type { Highs } from '../../shared/engine/plan/optimize';

const { input, targetPci } = workerData.payload as { input: PlanInput; targetPci?: number };
let last = 0;
const progress = (f: number) => {
  if (f - last >= 0.02) {
    last = f;
    parentPort!.postMessage({ type: 'progress', progress: f });
  }
};
try {
  const result =
    targetPci !== undefined
      ? budgetSearch(input, targetPci, progress)
      : runPlan(input, input.method === 'exact' ? ((await loadHighs()) as unknown as Highs) : null, progress);
  parentPort!.postMessage({ type: 'done', result });
} catch (err) {
  parentPort!.postMessage({ type: 'error', error: { message: (err as Error).message } });
}
