import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { type PlanSummary, plansKeys, plansPath } from './keys';

/** Publish the editable copy (or put `version` back), or withdraw with publish: false. */
export function usePublishPlan(agencyId: string, planId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (v: { publish: boolean; notifyViewers: boolean; version?: number }) =>
      api<PlanSummary & { notified: number }>(`${plansPath(agencyId)}/${planId}/publish`, { method: 'POST', json: v }),
    onSuccess: () => qc.invalidateQueries({ queryKey: plansKeys.all(agencyId) }),
  });
}
