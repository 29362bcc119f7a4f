// The pool's worker entry, in plain JavaScript: it registers tsx's loader in
// this thread so the TypeScript task files run under npm start, npm run dev and
// vitest alike, then hands every task to the TypeScript runner.
import { register } from 'tsx/esm/api';

register();
const { runTask } = await import('./task-runner.ts');
export default runTask;
