// The frozen input of a plan run or a budget search (inventory, curves, planning costs, settings), built
// in a worker: for a large inventory, reading the rows and fitting the curves takes many seconds.
import { defineTask } from '../pool/task';
import type { Snapshot } from '../runs/runs.service';
import { planInput } from './plan-input';

export type PlanSnapshotPayload = {
  agencyId: string;
  planId: string;
  userId: string;
  runId: string;
  targetPci?: number;
};

export default defineTask((p: PlanSnapshotPayload, ctx): Snapshot => {
  // planInput reads deps.db and nothing else; the worker's read-only connection is that.
  const input = planInput({ db: ctx.db() }, p.agencyId, p.planId);
  const text = JSON.stringify(input);
  if (p.targetPci !== undefined) return { input: `{"targetPci":${JSON.stringify(p.targetPci)},"plan":${text}}` };
  return {
    input: text,
    audit: {
      agencyId: p.agencyId,
      userId: p.userId,
      action: 'plan.run',
      entity: 'plan',
      entityId: p.planId,
      detail: { runId: p.runId, method: input.method },
    },
  };
});
