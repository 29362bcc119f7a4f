// Worker entry in plain JavaScript: it registers tsx's loader in this thread,
// then imports the TypeScript task module named in workerData.
import { workerData } from 'node:worker_threads';
import { register } from 'tsx/esm/api';

register();
await import(workerData.entry);
