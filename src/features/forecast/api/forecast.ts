import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { FamilyView } from '@shared/schemas/plans';
import { api } from '@/lib/api-client';

export type Family = FamilyView;
export type Curve = FamilyView['curve'];

export const familiesQueryOptions = (agencyId: string) =>
  queryOptions({
    queryKey: ['forecast', agencyId, 'families'],
    queryFn: () => api<{ families: Family[] }>(`/api/agencies/${agencyId}/forecast/families`),
  });

export const useFamilies = (agencyId: string) => useQuery(familiesQueryOptions(agencyId));

export function useSetCurve(agencyId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (v: { familyKey: string; curve: Curve | null }) =>
      api(`/api/agencies/${agencyId}/forecast/curves`, { method: 'PUT', json: v }),
    onSuccess: () => qc.invalidateQueries({ queryKey: familiesQueryOptions(agencyId).queryKey }),
  });
}
