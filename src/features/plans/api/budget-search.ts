import { useMutation } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { type Run, useRun } from '@/features/runs/api/use-run';
import { plansPath } from './keys';

export type BudgetSearch = {
  targetPci: number;
  budget: number | null;
  reachable: boolean;
  points: { budget: number; finalPci: number; minPci: number }[];
  tolerance?: string;
};
export const useStartBudgetSearch = (agencyId: string, planId: string) =>
  useMutation({
    mutationFn: (targetPci: number) =>
      api<Run<BudgetSearch>>(`${plansPath(agencyId)}/${planId}/budget-search`, {
        method: 'POST',
        json: { targetPci },
      }),
  });
/** A budget search run (the runs hook, typed). */
export const useBudgetSearch = (agencyId: string, runId: string | null) => useRun<BudgetSearch>(agencyId, runId);
