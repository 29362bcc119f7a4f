// The plans module's heavy tasks, each a file run in the worker pool.
import { taskRef } from '../pool/task';

export const planSnapshotTask = taskRef<typeof import('./plan-snapshot.task').default>(
  new URL('./plan-snapshot.task.ts', import.meta.url),
);
export const planRunTask = taskRef<typeof import('./plan-run.task').default>(
  new URL('./plan-run.task.ts', import.meta.url),
);
export const budgetSearchTask = taskRef<typeof import('./budget-search.task').default>(
  new URL('./budget-search.task.ts', import.meta.url),
);
export const optimizeTask = taskRef<typeof import('./optimize.task').default>(
  new URL('./optimize.task.ts', import.meta.url),
);
export const briefTask = taskRef<typeof import('./brief.task').default>(new URL('./brief.task.ts', import.meta.url));
export const workListTask = taskRef<typeof import('./work-list.task').default>(
  new URL('./work-list.task.ts', import.meta.url),
);
