import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { type PlanSummary, plansKeys, plansPath } from './keys';

export const planQueryOptions = (agencyId: string, planId: string) =>
  queryOptions({
    queryKey: plansKeys.detail(agencyId, planId),
    queryFn: () => api<PlanSummary>(`${plansPath(agencyId)}/${planId}`),
  });
export const usePlan = (agencyId: string, planId: string) => useQuery(planQueryOptions(agencyId, planId));
