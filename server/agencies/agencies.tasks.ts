// The agencies module's heavy tasks, each a file run in the worker pool.
import { taskRef } from '../pool/task';

export const agencyExportTask = taskRef<typeof import('./agency-export.task').default>(
  new URL('./agency-export.task.ts', import.meta.url),
);
export const agencyRestoreTask = taskRef<typeof import('./agency-restore.task').default>(
  new URL('./agency-restore.task.ts', import.meta.url),
);
