import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { type PlanSettings, type PlanSummary, plansKeys, plansPath } from './keys';

/** Saves name and settings; on a published plan the server opens a new draft version. */
export function useUpdatePlan(agencyId: string, planId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (v: { name: string; settings: PlanSettings }) =>
      api<PlanSummary>(`${plansPath(agencyId)}/${planId}`, { method: 'PUT', json: v }),
    onSuccess: () => qc.invalidateQueries({ queryKey: plansKeys.all(agencyId) }),
  });
}
