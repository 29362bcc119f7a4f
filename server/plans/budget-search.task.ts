// The search for the flat budget that holds a target PCI, on a plan's snapshot.
import { budgetSearch, type PlanInput } from '../../shared/engine/plan/run-plan';
import { defineTask } from '../pool/task';

export default defineTask((inputJson: string, ctx) => {
  const { targetPci, plan } = JSON.parse(inputJson) as { targetPci: number; plan: PlanInput };
  return JSON.stringify(budgetSearch(plan, targetPci, ctx.progress));
});
