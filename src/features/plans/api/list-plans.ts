import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { type PlanSummary, plansKeys, plansPath } from './keys';

export const plansQueryOptions = (agencyId: string) =>
  queryOptions({
    queryKey: plansKeys.list(agencyId),
    queryFn: () => api<{ items: PlanSummary[] }>(plansPath(agencyId)),
  });
export const usePlans = (agencyId: string) => useQuery(plansQueryOptions(agencyId));
