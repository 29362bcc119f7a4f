// The comparison's heavy tasks, each a file run in the worker pool.
import { taskRef } from '../pool/task';

export const comparisonSnapshotTask = taskRef<typeof import('./comparison-snapshot.task').default>(
  new URL('./comparison-snapshot.task.ts', import.meta.url),
);
export const comparisonTask = taskRef<typeof import('./comparison.task').default>(
  new URL('./comparison.task.ts', import.meta.url),
);
export const comparisonExportTask = taskRef<typeof import('./comparison-export.task').default>(
  new URL('./comparison-export.task.ts', import.meta.url),
);
