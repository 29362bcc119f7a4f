import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { type PlanSettings, plansKeys, plansPath } from './keys';

export type PlanVersion = {
  id: string;
  version: number;
  name: string;
  settings: PlanSettings;
  runId: string;
  publishedAt: string;
  publishedBy: string | null;
  current: boolean;
};
export type PlanVersions = { editing: { version: number; draft: boolean }; items: PlanVersion[] };

export const planVersionsQueryOptions = (agencyId: string, planId: string) =>
  queryOptions({
    queryKey: plansKeys.versions(agencyId, planId),
    queryFn: () => api<PlanVersions>(`${plansPath(agencyId)}/${planId}/versions`),
  });
export const usePlanVersions = (agencyId: string, planId: string, enabled = true) =>
  useQuery({ ...planVersionsQueryOptions(agencyId, planId), enabled });
