// The imports module's heavy tasks, each a file run in the worker pool.
import { taskRef } from '../pool/task';

export const importTask = taskRef<typeof import('./import.task').default>(new URL('./import.task.ts', import.meta.url));
