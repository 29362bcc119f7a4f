// A run's work, in a worker: reads its input bytes, runs the module's task on the text, and writes the
// result bytes itself (unless the run was cancelled meanwhile), so a large result never crosses threads.
import { defineTask, type Task } from '../pool/task';
import * as repo from './runs.repo';

export default defineTask(async (p: { runId: string; agencyId: string; work: string }, ctx) => {
  const input = repo.runInput(ctx.db(), p.agencyId, p.runId);
  if (!input) throw new Error('the run has no input');
  const work = ((await import(p.work)) as { default: Task<string, string> }).default;
  const result = Buffer.from(await work(input.toString('utf8'), ctx));
  return { written: repo.finishRun(ctx.writer(), p.runId, { status: 'done', result }) === 1 };
});
