// The segments module's heavy tasks, each a file run in the worker pool.
import { taskRef } from '../pool/task';

export const segmentsExportTask = taskRef<typeof import('./segments-export.task').default>(
  new URL('./segments-export.task.ts', import.meta.url),
);
