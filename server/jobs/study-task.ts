// Worker task: one life-cycle cost study with its Monte Carlo run.
import { parentPort, workerData } from 'node:worker_threads';
import type { StudyInput } from '../../shared/schemas/lcca';
import { runStudy, StudyInputError } from '../../shared/engine/lcca/study';

const input = workerData.payload as StudyInput;
let last = 0;
try {
  const result = runStudy(input, {
    onProgress: (f) => {
      if (f - last >= 0.05) {
        last = f;
        parentPort!.postMessage({ type: 'progress', progress: f });
      }
    },
  });
  parentPort!.postMessage({ type: 'done', result });
} catch (err) {
  parentPort!.postMessage({
    type: 'error',
    error: { message: (err as Error).message, path: err instanceof StudyInputError ? err.path : undefined },
  });
}
