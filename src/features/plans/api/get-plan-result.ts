import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { plansKeys, plansPath, type StoredResult } from './keys';

export type PlanResultAnswer = {
  latest: { runId: string; endedAt: string; version?: number | null; result: StoredResult } | null;
};

/** The latest finished result; viewers get the published version's, engineers `version`'s when given. */
export const planResultQueryOptions = (agencyId: string, planId: string, version?: number) =>
  queryOptions({
    queryKey: plansKeys.result(agencyId, planId, version),
    queryFn: () =>
      api<PlanResultAnswer>(`${plansPath(agencyId)}/${planId}/result${version ? `?version=${version}` : ''}`),
  });
export const usePlanResult = (agencyId: string, planId: string, version?: number) =>
  useQuery(planResultQueryOptions(agencyId, planId, version));
