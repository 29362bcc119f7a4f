import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import type { ComparisonResult } from '@shared/engine/lcca/comparison';
import type { ComparisonListSchema, ComparisonInput } from '@shared/schemas/comparisons';
import { api } from '@/lib/api-client';
import { comparisonKeys } from './keys';
import type { ComparisonRun } from './comparison-runs';

export const comparisonsQueryOptions = (agencyId: string) =>
  queryOptions({
    queryKey: comparisonKeys.list(agencyId),
    queryFn: () => api<z.infer<typeof ComparisonListSchema>>(`/api/agencies/${agencyId}/analyses`),
  });

export const useComparisons = (agencyId: string) => useQuery(comparisonsQueryOptions(agencyId));

export type SavedComparison = { id: string; name: string; input: ComparisonInput; result: ComparisonResult | null };

export const comparisonQueryOptions = (agencyId: string, id: string | null) =>
  queryOptions({
    queryKey: comparisonKeys.detail(agencyId, id),
    queryFn: () => api<SavedComparison>(`/api/agencies/${agencyId}/analyses/${id}`),
    enabled: !!id,
  });

export const useComparison = (agencyId: string, id: string | null) => useQuery(comparisonQueryOptions(agencyId, id));

export function useSaveComparison(agencyId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (v: { name: string; runId: string }) =>
      api<{ id: string }>(`/api/agencies/${agencyId}/analyses`, { method: 'POST', json: v }),
    onSuccess: () => qc.invalidateQueries({ queryKey: comparisonKeys.list(agencyId) }),
  });
}

export const useRerunComparison = (agencyId: string) =>
  useMutation({
    mutationFn: (id: string) =>
      api<ComparisonRun>(`/api/agencies/${agencyId}/analyses/${id}/rerun`, { method: 'POST' }),
  });
