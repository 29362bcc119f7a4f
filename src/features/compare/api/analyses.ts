import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import type { StudyResult } from '@shared/engine/lcca/study';
import type { AnalysisListSchema, StudyInput } from '@shared/schemas/lcca';
import { api } from '@/lib/api-client';
import { comparisonKeys } from './keys';
import type { StudyRun } from './study-runs';

export const analysesQueryOptions = (agencyId: string) =>
  queryOptions({
    queryKey: comparisonKeys.list(agencyId),
    queryFn: () => api<z.infer<typeof AnalysisListSchema>>(`/api/agencies/${agencyId}/analyses`),
  });

export const useAnalyses = (agencyId: string) => useQuery(analysesQueryOptions(agencyId));

export type SavedAnalysis = { id: string; name: string; input: StudyInput; result: StudyResult | null };

export const analysisQueryOptions = (agencyId: string, id: string | null) =>
  queryOptions({
    queryKey: comparisonKeys.detail(agencyId, id),
    queryFn: () => api<SavedAnalysis>(`/api/agencies/${agencyId}/analyses/${id}`),
    enabled: !!id,
  });

export const useAnalysis = (agencyId: string, id: string | null) => useQuery(analysisQueryOptions(agencyId, id));

export function useSaveAnalysis(agencyId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (v: { name: string; runId: string }) =>
      api<{ id: string }>(`/api/agencies/${agencyId}/analyses`, { method: 'POST', json: v }),
    onSuccess: () => qc.invalidateQueries({ queryKey: comparisonKeys.list(agencyId) }),
  });
}

export const useRerunAnalysis = (agencyId: string) =>
  useMutation({
    mutationFn: (id: string) => api<StudyRun>(`/api/agencies/${agencyId}/analyses/${id}/rerun`, { method: 'POST' }),
  });
