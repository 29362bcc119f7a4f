// The frozen input of a plan run (inventory, curves, planning costs, settings), built in a worker:
// for a large inventory, reading the rows and fitting the curves takes seconds.
import type { Deps } from '../deps';
import { defineTask } from '../pool/task';
import { planInput } from './plans.service';

export default defineTask((p: { agencyId: string; planId: string }, ctx) => {
  // planInput reads deps.db and nothing else; the worker's read-only connection is that.
  const input = planInput({ db: ctx.db() } as Deps, p.agencyId, p.planId);
  return { input: JSON.stringify(input), method: input.method };
});
