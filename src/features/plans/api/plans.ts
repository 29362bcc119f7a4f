import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { PlanResult } from '@shared/engine/plan/run-plan';
import type { PlanSettingsInput } from '@shared/schemas/plans';
import { api } from '@/lib/api-client';
import { type Run, useRun } from '@/features/runs/api/use-run';

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
export type PlanRun = Run<PlanResult>;

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

/** A plan run: polled, with progress, result and cancel (the runs hook, typed). */
export const usePlanRun = (agencyId: string, runId: string | null) => useRun<PlanResult>(agencyId, runId);

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
      api<Run<BudgetSearch>>(`${base(agencyId)}/${planId}/budget-search`, { method: 'POST', json: { targetPci } }),
  });
/** A budget search run (the runs hook, typed). */
export const useBudgetSearch = (agencyId: string, runId: string | null) => useRun<BudgetSearch>(agencyId, runId);
