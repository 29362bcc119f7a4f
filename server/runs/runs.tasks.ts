// The two steps every run takes in the worker pool.
import { taskRef } from '../pool/task';

export const runStartTask = taskRef<typeof import('./run-start.task').default>(
  new URL('./run-start.task.ts', import.meta.url),
);
export const runWorkTask = taskRef<typeof import('./run-work.task').default>(
  new URL('./run-work.task.ts', import.meta.url),
);
