import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { type PlanSettings, type PlanSummary, plansKeys, plansPath } from './keys';

export function useCreatePlan(agencyId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (v: { name: string; settings: PlanSettings }) =>
      api<PlanSummary>(plansPath(agencyId), { method: 'POST', json: v }),
    onSuccess: () => qc.invalidateQueries({ queryKey: plansKeys.all(agencyId) }),
  });
}
