// One plan run from its input snapshot (JSON text in, JSON text out).
import { type PlanInput, runPlan } from '../../shared/engine/plan/run-plan';
import { defineTask } from '../pool/task';
import { loadSolver } from './highs';

export default defineTask(async (inputJson: string, ctx) => {
  const input = JSON.parse(inputJson) as PlanInput;
  const highs = input.method === 'exact' ? await loadSolver() : null;
  return JSON.stringify(runPlan(input, highs, ctx.progress));
});
