// The budget choices a council weighs, side by side: the plan's own budget, 30 % less and 30 %
// more (the plan re-run on the same input snapshot with every year's budget scaled), and the
// budget the latest budget search found, when one ran. Runs in the brief's worker. The other
// columns use the fast method even when the plan is exact (the exact method may take up to its
// time limit per run, and publishing waits for the brief); the brief says so under the table.
import { type PlanInput, runPlan } from '../../shared/engine/plan/run-plan';
import { type AnyPlanResult, headline } from '../../shared/plan-headline';

export type BudgetChoice = {
  label: string;
  budgetPerYear: number;
  finalPci: number;
  laneMilesTreated: number;
  failedEnd: number;
  backlogEnd: number;
  thisPlan: boolean;
};

export async function budgetChoices(
  input: PlanInput,
  result: AnyPlanResult,
  search: { targetPci: number; budget: number | null; reachable: boolean } | null,
): Promise<BudgetChoice[]> {
  const at = (scale: number | null, flat: number | null, label: string): BudgetChoice => {
    const budgets = input.settings.budgets.map((b) => (flat !== null ? flat : b * (scale ?? 1)));
    const method = input.method === 'exact' ? 'fast' : input.method;
    const r = runPlan({ ...input, method, settings: { ...input.settings, budgets } }, null) as AnyPlanResult;
    const h = headline(r);
    return {
      label,
      budgetPerYear: h.budgetPerYear,
      finalPci: h.finalPci,
      laneMilesTreated: h.laneMilesTreated,
      failedEnd: h.failedEnd,
      backlogEnd: h.backlogEnd,
      thisPlan: false,
    };
  };
  const own = headline(result);
  const out: BudgetChoice[] = [
    at(0.7, null, '30 % less'),
    {
      label: 'This plan',
      budgetPerYear: own.budgetPerYear,
      finalPci: own.finalPci,
      laneMilesTreated: own.laneMilesTreated,
      failedEnd: own.failedEnd,
      backlogEnd: own.backlogEnd,
      thisPlan: true,
    },
    at(1.3, null, '30 % more'),
  ];
  if (search?.reachable && search.budget !== null) {
    const holdsToday = Math.abs(search.targetPci - own.startPci) < 1;
    out.push(at(null, search.budget, holdsToday ? 'Holds today’s PCI' : `Reaches PCI ${search.targetPci}`));
  }
  return out;
}
