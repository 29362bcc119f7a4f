import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { StudyResult } from '@shared/engine/lcca/study';
import type { RunStateView, StudyRequest } from '@shared/schemas/lcca';
import { api } from '@/lib/api-client';

export type StudyRun = Omit<RunStateView, 'result'> & { result?: StudyResult };

export const startStudy = (agencyId: string, req: StudyRequest) =>
  api<StudyRun>(`/api/agencies/${agencyId}/analyses/runs`, { method: 'POST', json: req });

export const studyRunQueryOptions = (agencyId: string, runId: string | null) =>
  queryOptions({
    queryKey: ['analyses', agencyId, 'runs', runId],
    queryFn: () => api<StudyRun>(`/api/agencies/${agencyId}/analyses/runs/${runId}`),
    enabled: !!runId,
    // Poll while the worker runs.
    refetchInterval: (q) => (q.state.data?.status === 'running' || !q.state.data ? 300 : false),
  });

export const useStudyRun = (agencyId: string, runId: string | null) => useQuery(studyRunQueryOptions(agencyId, runId));

export const useStartStudy = (agencyId: string) =>
  useMutation({ mutationFn: (req: StudyRequest) => startStudy(agencyId, req) });

export function useCancelStudy(agencyId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (runId: string) =>
      api<StudyRun>(`/api/agencies/${agencyId}/analyses/runs/${runId}`, { method: 'DELETE' }),
    onSuccess: (r) => qc.setQueryData(studyRunQueryOptions(agencyId, r.id).queryKey, r),
  });
}
