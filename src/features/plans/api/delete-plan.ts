import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { plansKeys, plansPath } from './keys';

export function useDeletePlan(agencyId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (planId: string) => api(`${plansPath(agencyId)}/${planId}`, { method: 'DELETE' }),
    onSuccess: () => qc.invalidateQueries({ queryKey: plansKeys.all(agencyId) }),
  });
}
