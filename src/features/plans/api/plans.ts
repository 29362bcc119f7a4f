import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { PlanResult } from '@shared/engine/plan/run-plan';
import type { PlanSettingsInput } from '@shared/schemas/plans';
import { api } from '@/lib/api-client';

export type PlanSummary = {
  id: string;
  name: string;
  status: 'draft' | 'published';
  settings: PlanSettingsInput;
  createdAt: string;
  updatedAt: string;
  publishedAt: string | null;
  lastRun: { id: string; status: string; startedAt: string; endedAt: string | null } | null;
};
export type PlanRun = {
  id: string;
  status: 'running' | 'done' | 'failed' | 'cancelled';
  progress: number;
  error: string | null;
  result: PlanResult | null;
};

const base = (agencyId: string) => `/api/agencies/${agencyId}/plans`;

export const plansQueryOptions = (agencyId: string) =>
  queryOptions({ queryKey: ['plans', agencyId, 'list'], queryFn: () => api<{ items: PlanSummary[] }>(base(agencyId)) });
export const usePlans = (agencyId: string) => useQuery(plansQueryOptions(agencyId));

export const planQueryOptions = (agencyId: string, planId: string) =>
  queryOptions({
    queryKey: ['plans', agencyId, 'detail', planId],
    queryFn: () => api<PlanSummary>(`${base(agencyId)}/${planId}`),
  });
export const usePlan = (agencyId: string, planId: string) => useQuery(planQueryOptions(agencyId, planId));

export const planResultQueryOptions = (agencyId: string, planId: string) =>
  queryOptions({
    queryKey: ['plans', agencyId, 'result', planId],
    queryFn: () =>
      api<{ latest: { runId: string; endedAt: string; result: PlanResult } | null }>(
        `${base(agencyId)}/${planId}/result`,
      ),
  });
export const usePlanResult = (agencyId: string, planId: string) => useQuery(planResultQueryOptions(agencyId, planId));

export const planRunQueryOptions = (agencyId: string, planId: string, runId: string | null) =>
  queryOptions({
    queryKey: ['plans', agencyId, 'run', planId, runId],
    queryFn: () => api<PlanRun>(`${base(agencyId)}/${planId}/runs/${runId}`),
    enabled: !!runId,
    refetchInterval: (q) => (!q.state.data || q.state.data.status === 'running' ? 400 : false),
  });
export const usePlanRun = (agencyId: string, planId: string, runId: string | null) =>
  useQuery(planRunQueryOptions(agencyId, planId, runId));

function useInvalidatePlans(agencyId: string) {
  const qc = useQueryClient();
  return () => qc.invalidateQueries({ queryKey: ['plans', agencyId] });
}

export function useCreatePlan(agencyId: string) {
  const inv = useInvalidatePlans(agencyId);
  return useMutation({
    mutationFn: (v: { name: string; settings: PlanSettingsInput }) =>
      api<PlanSummary>(base(agencyId), { method: 'POST', json: v }),
    onSuccess: inv,
  });
}
export function useUpdatePlan(agencyId: string, planId: string) {
  const inv = useInvalidatePlans(agencyId);
  return useMutation({
    mutationFn: (v: { name: string; settings: PlanSettingsInput }) =>
      api<PlanSummary>(`${base(agencyId)}/${planId}`, { method: 'PUT', json: v }),
    onSuccess: inv,
  });
}
export function useRunPlan(agencyId: string, planId: string) {
  return useMutation({ mutationFn: () => api<PlanRun>(`${base(agencyId)}/${planId}/run`, { method: 'POST' }) });
}
export function useCancelPlanRun(agencyId: string, planId: string) {
  const inv = useInvalidatePlans(agencyId);
  return useMutation({
    mutationFn: (runId: string) => api<PlanRun>(`${base(agencyId)}/${planId}/runs/${runId}`, { method: 'DELETE' }),
    onSuccess: inv,
  });
}
export function usePublishPlan(agencyId: string, planId: string) {
  const inv = useInvalidatePlans(agencyId);
  return useMutation({
    mutationFn: (v: { publish: boolean; notifyViewers: boolean }) =>
      api<PlanSummary & { notified: number }>(`${base(agencyId)}/${planId}/publish`, { method: 'POST', json: v }),
    onSuccess: inv,
  });
}
export function useDeletePlan(agencyId: string) {
  const inv = useInvalidatePlans(agencyId);
  return useMutation({
    mutationFn: (planId: string) => api(`${base(agencyId)}/${planId}`, { method: 'DELETE' }),
    onSuccess: inv,
  });
}

export type BudgetSearch = {
  targetPci: number;
  budget: number | null;
  reachable: boolean;
  points: { budget: number; finalPci: number; minPci: number }[];
};
export const useStartBudgetSearch = (agencyId: string, planId: string) =>
  useMutation({
    mutationFn: (targetPci: number) =>
      api<{ id: string }>(`${base(agencyId)}/${planId}/budget-search`, { method: 'POST', json: { targetPci } }),
  });
export const jobQueryOptions = (agencyId: string, jobId: string | null) =>
  queryOptions({
    queryKey: ['jobs', agencyId, jobId],
    queryFn: () =>
      api<{ id: string; status: string; progress: number; result?: BudgetSearch; error?: { message: string } }>(
        `/api/agencies/${agencyId}/jobs/${jobId}`,
      ),
    enabled: !!jobId,
    refetchInterval: (q) => (!q.state.data || q.state.data.status === 'running' ? 400 : false),
  });
export const useJob = (agencyId: string, jobId: string | null) => useQuery(jobQueryOptions(agencyId, jobId));
