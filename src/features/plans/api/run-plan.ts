import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { type Run, useRun } from '@/features/runs/api/use-run';
import { type PlanSettings, plansKeys, plansPath, type StoredResult } from './keys';

export type PlanRun = Run<StoredResult>;

/** Starts a run; the screen's unsaved name and settings go with it and are saved first. */
export function useRunPlan(agencyId: string, planId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (edits?: { name: string; settings: PlanSettings }) =>
      api<PlanRun>(`${plansPath(agencyId)}/${planId}/run`, { method: 'POST', json: edits ?? {} }),
    onSuccess: () => qc.invalidateQueries({ queryKey: plansKeys.all(agencyId) }),
  });
}

/** A plan run: polled, with progress, result and cancel (the runs hook, typed). */
export const usePlanRun = (agencyId: string, runId: string | null) => useRun<StoredResult>(agencyId, runId);
